// A three-node MariaDB Galera cluster on 127.0.0.1 for `npm run test:cluster`: Debian's mariadb-server,
// galera-4 and mariadb-backup (state transfer), private data folders under .cluster-data/, root only
// through each node's socket. Test data only: every run starts from empty folders.
import { execFileSync, spawn } from 'node:child_process'
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { setTimeout as sleep } from 'node:timers/promises'

export interface GaleraNode {
  index: number
  dir: string
  sock: string
  pidFile: string
  port: number
}

const PROVIDER = '/usr/lib/galera/libgalera_smm.so'

export function ensurePackages(): void {
  const missing = ['mariadb-server', 'galera-4', 'mariadb-backup'].filter((p) => {
    try {
      return !execFileSync('dpkg-query', ['-W', '-f=${Status}', p], { encoding: 'utf8' }).includes(
        'installed',
      )
    } catch {
      return true
    }
  })
  if (!missing.length) return
  console.log(`Installing ${missing.join(' ')}...`)
  execFileSync('apt-get', ['install', '-y', '--no-install-recommends', ...missing], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  })
}

export function nodesAt(root: string, basePort: number): GaleraNode[] {
  return [1, 2, 3].map((index) => {
    const dir = resolve(root, `node${index}`)
    return {
      index,
      dir,
      sock: join(dir, 'mysqld.sock'),
      pidFile: join(dir, 'mysqld.pid'),
      port: basePort + index,
    }
  })
}

function ping(n: GaleraNode): boolean {
  try {
    execFileSync('mariadb-admin', ['--no-defaults', '--protocol=socket', `--socket=${n.sock}`, 'ping'], {
      stdio: 'ignore',
    })
    return true
  } catch {
    return false
  }
}

export function rootSql(n: GaleraNode, sql: string): string {
  return execFileSync(
    'mariadb',
    ['--no-defaults', '--protocol=socket', `--socket=${n.sock}`, '-uroot', '-N', '-e', sql],
    {
      encoding: 'utf8',
    },
  )
}

export function initNode(n: GaleraNode): void {
  rmSync(n.dir, { recursive: true, force: true })
  mkdirSync(n.dir, { recursive: true, mode: 0o700 })
  execFileSync(
    'mariadb-install-db',
    ['--no-defaults', '--user=root', `--datadir=${join(n.dir, 'db')}`, '--skip-test-db'],
    {
      stdio: 'ignore',
    },
  )
}

/** Starts one node; the first node of a new cluster bootstraps it. */
export async function startNode(
  n: GaleraNode,
  all: GaleraNode[],
  bootstrap: boolean,
  basePort: number,
): Promise<void> {
  const g = (m: GaleraNode) => basePort + 10 + m.index
  const options = [
    'user=root',
    `datadir=${join(n.dir, 'db')}`,
    `socket=${n.sock}`,
    `pid-file=${n.pidFile}`,
    `log-error=${join(n.dir, 'mysqld.err')}`,
    `port=${n.port}`,
    'bind-address=127.0.0.1',
    'skip-name-resolve',
    'innodb-buffer-pool-size=64M',
    'binlog-format=ROW',
    'innodb-autoinc-lock-mode=2',
    'wsrep-on=ON',
    `wsrep-provider=${PROVIDER}`,
    'wsrep-cluster-name=lampwright-test',
    `wsrep-cluster-address=gcomm://${all.map((m) => `127.0.0.1:${g(m)}`).join(',')}`,
    `wsrep-node-address=127.0.0.1:${g(n)}`,
    `wsrep-provider-options="gmcast.listen_addr=tcp://127.0.0.1:${g(n)};ist.recv_addr=127.0.0.1:${basePort + 20 + n.index}"`,
    `wsrep-sst-receive-address=127.0.0.1:${basePort + 30 + n.index}`,
    'wsrep-sst-method=mariabackup',
    'wsrep-sst-auth=root:',
  ]
  // The node's own option file only: the state-transfer script reads the same file, never the
  // system's /etc/mysql (whose datadir, socket and syslog settings would send it astray).
  const cnf = join(n.dir, 'my.cnf')
  writeFileSync(
    cnf,
    ['[mysqld]', ...options, '', '[sst]', 'sst-syslog=-1', 'sst-log-archive=0', ''].join('\n'),
  )
  const args = [`--defaults-file=${cnf}`, ...(bootstrap ? ['--wsrep-new-cluster'] : [])]
  const child = spawn('mariadbd', args, { stdio: 'ignore', detached: true })
  child.unref()
  const until = Date.now() + 120_000
  while (!ping(n) || !synced(n)) {
    if (Date.now() > until)
      throw new Error(`Galera node ${n.index} did not join: see ${join(n.dir, 'mysqld.err')}`)
    await sleep(250)
  }
}

function synced(n: GaleraNode): boolean {
  try {
    return rootSql(n, "show status like 'wsrep_local_state_comment'").includes('Synced')
  } catch {
    return false
  }
}

export function clusterSize(n: GaleraNode): number {
  return Number(rootSql(n, "show status like 'wsrep_cluster_size'").trim().split(/\s+/)[1])
}

export function killNode(n: GaleraNode): void {
  if (!existsSync(n.pidFile)) return
  try {
    process.kill(Number(readFileSync(n.pidFile, 'utf8')), 'SIGKILL')
  } catch {
    // already gone
  }
  rmSync(n.pidFile, { force: true })
}

export async function stopNode(n: GaleraNode): Promise<void> {
  if (!existsSync(n.pidFile)) return
  try {
    process.kill(Number(readFileSync(n.pidFile, 'utf8')), 'SIGTERM')
  } catch {
    return
  }
  const until = Date.now() + 60_000
  while (ping(n) && Date.now() < until) await sleep(200)
}
