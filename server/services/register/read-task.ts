// The pool task of an import: parse the file and check every row. Input problems come back as
// { err } like the other tasks' (see server/workers/tasks.ts).
import { checkRows, type Checked, type Lookups } from './check-rows'
import { FileProblem, parseFile, type FileFormat } from './parse-file'

export interface ReadInput {
  bytes: Uint8Array
  format: FileFormat
  lookups: Lookups
}

type Reply = { ok: Checked } | { err: { status: number; code: string; message: string; details?: unknown } }

export async function readRegisterFile(input: ReadInput): Promise<Reply> {
  try {
    const rows = await parseFile(input.bytes, input.format)
    return { ok: checkRows(rows, input.lookups) }
  } catch (err) {
    if (err instanceof FileProblem)
      return { err: { status: err.status, code: err.code, message: err.message, details: err.details } }
    throw err
  }
}
