// `npm run db -- start|stop|status [dev|test]`: the private MariaDB by hand, for development.
// A server started here keeps running until stopped; npm start and npm test reuse it.
import path from 'node:path'
import { dataRoot, ensureEmbeddedServer, shutdownEmbeddedServer } from './embeddedMariadb.js'

const [command = 'status', profile = 'dev'] = process.argv.slice(2)
const ports: Record<string, number> = { dev: 3406, test: 3407 }
if (!ports[profile]) {
  console.error(`Unknown profile "${profile}": use dev or test.`)
  process.exit(2)
}
const port = Number(process.env.LUMENYARD_DB_PORT) || ports[profile]
const socket = path.join(dataRoot, profile, 'mysqld.sock')

if (command === 'start') {
  const s = await ensureEmbeddedServer({ name: profile, port })
  console.log(`${profile} MariaDB ${s.startedHere ? 'started' : 'already running'} on 127.0.0.1:${port}`)
} else if (command === 'stop') {
  await shutdownEmbeddedServer(socket)
  console.log(`${profile} MariaDB stopped`)
} else {
  console.log(`usage: npm run db -- start|stop [dev|test]`)
}
