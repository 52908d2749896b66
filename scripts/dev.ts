// npm run dev: the API (with the private database) plus Vite with hot reload, proxied to the API.
// scripts/start.ts decides the demo mode and stops its database when the API fails to start.
import { spawn } from 'node:child_process'

const api = spawn('node', ['--import', 'tsx', 'scripts/start.ts', '--api-only'], { stdio: 'inherit' })
const vite = spawn('npx', ['vite', '--host', '127.0.0.1'], { stdio: 'inherit' })
const stop = () => {
  vite.kill('SIGTERM')
  api.kill('SIGTERM')
}
process.once('SIGINT', stop)
process.once('SIGTERM', stop)
api.on('exit', (code) => {
  vite.kill('SIGTERM')
  process.exitCode = code ?? 0
})
