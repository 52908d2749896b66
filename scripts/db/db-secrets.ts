// Files and SQL that keep the private MariaDB closed: generated passwords (0600) in a data folder
// (0700) that also holds the socket, and a root account reachable only through that socket.
import { chmodSync, existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { randomBytes } from 'node:crypto'
import { join } from 'node:path'

export interface DbPaths {
  dir: string
  data: string
  sock: string
  pidFile: string
  errLog: string
  /** Client option file for root (`mariadb --defaults-file=…`): user, password and socket. */
  rootCnf: string
  rootPassword: string
  appPassword: string
  initSql: string
}

export function dbPaths(dir: string): DbPaths {
  return {
    dir,
    data: join(dir, 'db'),
    sock: join(dir, 'mysqld.sock'),
    pidFile: join(dir, 'mysqld.pid'),
    errLog: join(dir, 'mysqld.err'),
    rootCnf: join(dir, 'root.cnf'),
    rootPassword: join(dir, 'root-password'),
    appPassword: join(dir, 'db-password'),
    initSql: join(dir, 'init.sql'),
  }
}

/** Creates the folder 0700, or tightens one made by older code (0755) in place. */
export function privateDir(dir: string): void {
  mkdirSync(dir, { recursive: true, mode: 0o700 })
  chmodSync(dir, 0o700)
}

/** A secret file's content, generated (0600) on first use; an older file is tightened to 0600. */
export function secret(file: string): string {
  if (!existsSync(file)) writeFileSync(file, randomBytes(18).toString('hex'), { mode: 0o600, flag: 'wx' })
  chmodSync(file, 0o600)
  const s = readFileSync(file, 'utf8').trim()
  if (!/^[\w.~-]{12,}$/.test(s))
    throw new Error(`${file} holds no usable password; delete it to make a new one`)
  return s
}

export const sqlString = (s: string) => `'${s.replace(/\\/g, '\\\\').replace(/'/g, "\\'")}'`

/**
 * Root only on localhost, i.e. the socket (with --skip-name-resolve a TCP client is never
 * "localhost"): by the OS user root (unix_socket) or with the generated password. Removes the
 * passwordless root@127.0.0.1, root@::1, root@<hostname> and anonymous accounts that
 * mariadb-install-db made for the older set-up. Each statement on one line (--init-file needs it).
 */
export function hardeningSql(rootPassword: string): string {
  return [
    "DELETE FROM mysql.global_priv WHERE User = '' OR (User = 'root' AND Host <> 'localhost');",
    'FLUSH PRIVILEGES;',
    `ALTER USER 'root'@'localhost' IDENTIFIED VIA unix_socket OR mysql_native_password USING PASSWORD(${sqlString(rootPassword)});`,
  ].join('\n')
}

/** Writes root's option file and the init file the server runs before it accepts any connection. */
export function writeRootFiles(p: DbPaths, rootPassword: string): void {
  const cnf = `[client]\nuser=root\npassword=${rootPassword}\nsocket=${p.sock}\nprotocol=socket\n`
  rmSync(p.rootCnf, { force: true })
  writeFileSync(p.rootCnf, cnf, { mode: 0o600 })
  rmSync(p.initSql, { force: true })
  writeFileSync(p.initSql, hardeningSql(rootPassword) + '\n', { mode: 0o600 })
}
