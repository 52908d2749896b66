// Start-up failures told in one line: what went wrong and what to do. The full error (with its
// stack) is printed only with LOG_LEVEL=debug.

/** A failure whose message is already the one line to print. */
export class StartError extends Error {
  override name = 'StartError'
}

/** Marks a listen error with the setting that chooses the port, for the message. */
export function portError(err: unknown, port: number, setting: string): unknown {
  if (err && typeof err === 'object') Object.assign(err, { port, setting })
  return err
}

const firstLine = (s: string) => s.split('\n')[0].trim()

export function startErrorLine(err: unknown): string {
  if (err instanceof StartError) return err.message
  const e = (err ?? {}) as {
    name?: string
    code?: string
    message?: string
    sqlMessage?: string
    setting?: string
    port?: number
    address?: string
    hostname?: string
  }
  if (e.name === 'SettingError') return String(e.message)
  const where = e.setting ? `set ${e.setting}` : 'choose another port'
  switch (e.code) {
    case 'EADDRINUSE':
      return `port ${e.port} is in use: ${where}`
    case 'EACCES':
      return `port ${e.port} may not be opened by this user: ${where} (1024 or above)`
    case 'ECONNREFUSED':
      return `the database at ${e.address}:${e.port} refused the connection: start it or fix DATABASE_URL`
    case 'ENOTFOUND':
      return `the database host ${e.hostname ?? ''} is unknown: fix DATABASE_URL`
    case 'ETIMEDOUT':
      return 'the database did not answer in time: check DATABASE_URL and the network'
    case 'ER_ACCESS_DENIED_ERROR':
      return `the database refused the login (${firstLine(e.sqlMessage ?? '')}): fix the user or password in DATABASE_URL`
    case 'ER_DBACCESS_DENIED_ERROR':
      return `${firstLine(e.sqlMessage ?? 'access denied')}: create the database and grant the user rights on it, or fix DATABASE_URL`
    case 'ER_BAD_DB_ERROR':
      return `${firstLine(e.sqlMessage ?? 'unknown database')}: create it or fix DATABASE_URL`
  }
  const msg = firstLine(e.message ?? String(err)) || 'unknown error'
  return `start failed: ${msg} (run with LOG_LEVEL=debug for the details)`
}

/** The one line, then the full error when LOG_LEVEL asks for details. */
export function reportStartError(err: unknown, logLevel = process.env.LOG_LEVEL): void {
  console.error(startErrorLine(err))
  if (logLevel === 'debug' || logLevel === 'trace') console.error(err)
}
