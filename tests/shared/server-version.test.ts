import { describe, expect, it } from 'vitest'
import { versionProblem } from '../../scripts/db/server-version'

// What `SELECT VERSION()` answers, as the servers print it: Debian 12's MariaDB package
// (10.11.x-MariaDB-0+deb12u1, read from this machine), MariaDB 10.4 (the last release without
// JSON_ARRAYAGG, which came with 10.5) and MySQL 8.0, whose JSON_ARRAYAGG takes no ORDER BY. The
// release facts and the other version strings are from memory.
describe('the database server check at start-up', () => {
  it("accepts Debian's MariaDB 10.11 and later MariaDB releases", () => {
    expect(versionProblem('10.11.19-MariaDB-0+deb12u1')).toBeNull()
    expect(versionProblem('10.5.0-MariaDB')).toBeNull()
    expect(versionProblem('11.4.2-MariaDB-log')).toBeNull()
  })

  it('refuses MariaDB 10.4 and MySQL with a sentence naming what is needed', () => {
    expect(versionProblem('10.4.32-MariaDB')).toBe(
      'Lampwright needs MariaDB 10.5 or later; this server is MariaDB 10.4.32.',
    )
    expect(versionProblem('8.0.36')).toBe(
      'Lampwright needs MariaDB 10.5 or later; this server reports "8.0.36".',
    )
  })
})
