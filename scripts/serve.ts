// `npm start`: database, migrations, demo scenario on an empty database, client build, the app and
// its local mail and card-payment fakes, on 127.0.0.1. Ctrl-C stops everything cleanly.
import { spawnSync } from 'node:child_process'
import path from 'node:path'
import { loadConfig } from '../server/config.js'
import { startServer } from '../server/main.js'
import { DEMO_PASSWORD, DEMO_USERS } from '../server/demo/demoUsers.js'
import { startSmtpFake, type SmtpFake } from '../server/fakes/smtpFake.js'
import { startPayFake, type PayFake } from '../server/fakes/payFake.js'
import { PAYMENT_WEBHOOK_PATH } from '../server/routes/payments.js'
import { dataRoot, projectRoot } from './embeddedMariadb.js'
import { prepareEnvironment } from './environment.js'

async function main() {
  const skipBuild = process.argv.includes('--no-build')
  const prepared = await prepareEnvironment('dev', { database: process.env.LUMENYARD_DB_NAME ?? 'lumenyard' })
  Object.assign(process.env, prepared.env)
  const config = loadConfig()

  let smtp: SmtpFake | null = null
  if (!process.env.LUMENYARD_SMTP_HOST && config.env !== 'production') {
    smtp = await startSmtpFake({ port: config.smtp.port, saveDir: path.join(dataRoot, 'dev', 'mail') })
  }
  let pay: PayFake | null = null
  if (config.pay.localFake) {
    pay = await startPayFake({ port: config.pay.fakePort, secretKey: config.pay.secretKey, webhookSecret: config.pay.webhookSecret })
  }
  if (!skipBuild) {
    console.log('lumenyard: building the client…')
    const build = spawnSync(path.join(projectRoot, 'node_modules/.bin/vite'), ['build', '--logLevel', 'warn'], {
      cwd: projectRoot,
      stdio: 'inherit',
    })
    if (build.status !== 0) throw new Error('The client build failed (see above).')
  }
  const running = await startServer(config, { loadDemo: true })
  if (pay) pay.webhookUrl = running.url + PAYMENT_WEBHOOK_PATH
  console.log(`\nLumenyard is running at ${running.url}`)
  if (smtp) console.log(`Mail fake (SMTP) on 127.0.0.1:${smtp.port}; messages kept in .data/dev/mail`)
  if (pay) console.log(`Card-payment fake on ${pay.url} (test cards only; its events go to ${pay.webhookUrl})`)
  if (prepared.server) console.log(`MariaDB (private) on 127.0.0.1:${prepared.server.port}; data in .data/dev/mariadb`)
  if (config.env !== 'production') {
    console.log(`Demo sign-ins (password "${DEMO_PASSWORD}"): ${DEMO_USERS.map((u) => u.username).join(', ')}`)
  }
  console.log('Press Ctrl-C to stop.\n')

  let stopping = false
  const stop = async () => {
    if (stopping) return
    stopping = true
    console.log('\nlumenyard: stopping…')
    await running.close().catch((e) => console.error(e))
    await smtp?.close().catch(() => undefined)
    await pay?.close().catch(() => undefined)
    await prepared.stop().catch((e) => console.error(e))
    process.exit(0)
  }
  process.on('SIGINT', stop)
  process.on('SIGTERM', stop)
}

main().catch((err) => {
  console.error(`lumenyard: ${err instanceof Error ? err.message : err}`)
  process.exit(1)
})
