// The database server Lampwright needs: MariaDB 10.5 or later. The string page builds ordered JSON
// lists inside its query (JSON_ARRAYAGG … ORDER BY … LIMIT, which MariaDB has from 10.5), and the
// cluster set-up is Galera's. Checked once at start-up so an older server stops with a sentence, not a SQL error on
// the first string page.
export const MIN_MARIADB: [number, number] = [10, 5]

/** Why `version` (as `SELECT VERSION()` answers) will not do, or null when it will. */
export function versionProblem(version: string): string | null {
  const m = /^(\d+)\.(\d+)\.(\d+)/.exec(version)
  const need = `MariaDB ${MIN_MARIADB.join('.')} or later`
  if (!m || !/mariadb/i.test(version)) return `Lampwright needs ${need}; this server reports "${version}".`
  const [major, minor] = [Number(m[1]), Number(m[2])]
  const [wantMajor, wantMinor] = MIN_MARIADB
  if (major > wantMajor || (major === wantMajor && minor >= wantMinor)) return null
  return `Lampwright needs ${need}; this server is MariaDB ${m[0]}.`
}
