// Starts Lumenyard: database, migrations, (demo data), HTTP server, graceful shutdown.
import type { Server } from 'node:http'
import type { AppConfig } from './config.js'
import { createApp } from './app.js'
import { createDataSource } from './db/dataSource.js'
import { checkDurability } from './db/outage.js'
import { isDatabaseEmpty, loadDemoScenario } from './demo/index.js'
import { createLogger } from './logger.js'

export interface RunningServer {
  url: string
  close(): Promise<void>
}

export async function startServer(config: AppConfig, opts: { loadDemo?: boolean } = {}): Promise<RunningServer> {
  const logger = createLogger(config.logLevel)
  const ds = createDataSource(config)
  await ds.initialize()
  await checkDurability(ds, logger)
  const ran = await ds.runMigrations({ transaction: 'each' })
  if (ran.length) logger.info({ migrations: ran.map((m) => m.name) }, 'migrations applied')
  if (opts.loadDemo && config.env !== 'production' && (await isDatabaseEmpty(ds))) {
    logger.info('empty database: loading the demo scenario')
    await loadDemoScenario(ds, (m) => logger.info(m))
  }
  // Reports and dashboards read the replica when one is configured (ctx.readDs).
  const readDs = config.readDb ? createDataSource({ db: config.readDb }) : undefined
  if (readDs) {
    await readDs.initialize()
    logger.info({ host: config.readDb!.host, port: config.readDb!.port }, 'reports read from the replica')
  }
  const built = createApp({ config, ds, readDs, logger })
  const server: Server = await new Promise<Server>((resolve, reject) => {
    // Express 5 calls listen's callback with the error too (a port taken): only a call without one means listening.
    const s = built.app.listen(config.port, config.host, (err?: Error) => {
      if (!err) resolve(s)
    })
    s.once('error', (err: NodeJS.ErrnoException) => {
      if (err.code === 'EADDRINUSE') {
        reject(new Error(`Port ${config.port} on ${config.host} is already in use: is Lumenyard already running? Set LUMENYARD_PORT to use another port.`))
      } else reject(err)
    })
  }).catch(async (err: unknown) => {
    await built.close()
    await readDs?.destroy()
    await ds.destroy()
    throw err
  })
  const address = server.address()
  const port = typeof address === 'object' && address ? address.port : config.port
  return {
    url: `http://${config.host}:${port}`,
    close: async () => {
      await new Promise<void>((resolve) => {
        server.close(() => resolve())
        server.closeAllConnections?.()
      })
      await built.close()
      await readDs?.destroy()
      await ds.destroy()
    },
  }
}
