// One app process configured by environment variables alone: no embedded database, no client build,
// no mail fake. The crash tests and the two-process scale set-up start it as a child process.
import { loadConfig } from '../server/config.js'
import { startServer } from '../server/main.js'

const running = await startServer(loadConfig(), { loadDemo: false })
console.log(`lumenyard app process ${process.pid} listening at ${running.url}`)
const stop = async () => {
  await running.close().catch(() => undefined)
  process.exit(0)
}
process.on('SIGINT', stop)
process.on('SIGTERM', stop)
