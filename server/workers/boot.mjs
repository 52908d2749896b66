// The pool's worker entry. Node starts a worker's entry without the tsx hook (even under --import tsx,
// and vitest has no tsx at all), so this plain module loads the TypeScript tasks through tsx's API.
import { tsImport } from 'tsx/esm/api'

const tasks = await tsImport('./tasks.ts', import.meta.url)

export default tasks.runTask
