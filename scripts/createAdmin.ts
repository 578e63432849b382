// `npm run create-admin`: the first administrator of a production installation. Asks for the user
// name, name and password (never a default password); refuses a user name that exists.
import { createInterface } from 'node:readline/promises'
import { stdin, stdout } from 'node:process'
import { passwordSchema, usernameSchema } from '../shared/schemas/auth.js'
import { loadConfig } from '../server/config.js'
import { createDataSource } from '../server/db/dataSource.js'
import { createUser } from '../server/services/userService.js'
import { prepareEnvironment } from './environment.js'

async function ask(question: string, hidden = false): Promise<string> {
  const rl = createInterface({ input: stdin, output: stdout, terminal: true })
  if (hidden) {
    const write = (rl as unknown as { _writeToOutput: (s: string) => void })
    write._writeToOutput = (s: string) => { if (s.includes(question)) stdout.write(s) }
  }
  const answer = await rl.question(question)
  rl.close()
  if (hidden) stdout.write('\n')
  return answer.trim()
}

const prepared = await prepareEnvironment('dev', { database: process.env.LUMENYARD_DB_NAME ?? 'lumenyard' })
Object.assign(process.env, prepared.env)
const ds = createDataSource(loadConfig())
await ds.initialize()
await ds.runMigrations({ transaction: 'each' })
try {
  const username = usernameSchema.parse(await ask('User name for the administrator: '))
  const displayName = (await ask('Full name: ')) || username
  const password = await ask('Password (at least 12 characters): ', true)
  passwordSchema.parse(password)
  if ((await ask('Repeat the password: ', true)) !== password) throw new Error('The passwords differ.')
  const user = await createUser(ds, { userId: null }, { username, displayName, roles: ['admin'], password, email: '' })
  console.log(`Administrator ${user.username} created.`)
} catch (err) {
  const message = err && typeof err === 'object' && 'issues' in err ? (err as { issues: { message: string }[] }).issues.map((i) => i.message).join('; ') : (err as Error).message
  console.error(`Not created: ${message}`)
  process.exitCode = 1
} finally {
  await ds.destroy()
  await prepared.stop()
}
