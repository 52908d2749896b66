// Many rows updated with values of their own in one statement per 200 rows (`set col = case id when
// … then … end`), instead of one statement per row: the queue refresh writes thousands at a time.
import type { Db } from '../db'

const CHUNK = 200
const snake = (name: string) => name.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`)

/**
 * Sets each row's own `columns` (camelCase keys of the rows) and the `same` values on every row, where
 * the row's id matches and `also` holds (raw SQL on the table, e.g. "status in ('lit', 'watch')").
 */
export async function updateById(
  db: Db,
  table: string,
  rows: ({ id: number } & Record<string, unknown>)[],
  columns: string[],
  o: { same?: Record<string, unknown>; also?: string } = {},
): Promise<void> {
  const same = Object.entries(o.same ?? {})
  for (let i = 0; i < rows.length; i += CHUNK) {
    const chunk = rows.slice(i, i + CHUNK)
    const cases = chunk.map(() => 'when ? then ?').join(' ')
    const sets = [
      ...columns.map((c) => `${snake(c)} = case id ${cases} end`),
      ...same.map(([c]) => `${snake(c)} = ?`),
    ]
    const bindings = [
      ...columns.flatMap((c) => chunk.flatMap((r) => [r.id, r[c] as never])),
      ...same.map(([, v]) => v as never),
      ...chunk.map((r) => r.id),
    ]
    const ids = chunk.map(() => '?').join(',')
    await db.raw(
      `update ${snake(table)} set ${sets.join(', ')} where id in (${ids})${o.also ? ` and (${o.also})` : ''}`,
      bindings,
    )
  }
}
