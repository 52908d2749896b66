// One API worker under server/cluster.ts: starts the server and tells the primary its port.
import { startServer } from './index'
import { startErrorLine } from './start-errors'
import type { WorkerMessage } from './cluster'

const tell = (m: WorkerMessage) => process.send?.(m)

try {
  const running = await startServer(process.env)
  tell({ type: 'ready', port: running.port })
  const stop = async () => {
    await running.close()
    process.exit(0)
  }
  process.once('SIGINT', () => {}) // the primary decides when to stop (Ctrl-C reaches every process)
  process.once('SIGTERM', () => void stop())
} catch (err) {
  tell({ type: 'failed', message: startErrorLine(err) })
  process.exit(1)
}
