// Lumenyard for a benchmark: the production start (no demo loading, migrations already run), its
// address sent to the parent process. Stops on SIGTERM.
import { loadConfig } from '../../server/config.js'
import { startServer } from '../../server/main.js'

const running = await startServer(loadConfig(process.env))
process.send?.({ url: running.url })
process.once('SIGTERM', () => {
  running.close().finally(() => process.exit(0))
})
// The bench runner gone (stopped, or failed midway): stop too, rather than keep the port.
process.once('disconnect', () => process.exit(0))
