import type { Response } from 'express'

/** A keyed write's answer: the row's own status (201) when it made the record, 200 for a replay. */
export async function keyedAnswer<T>(
  res: Response,
  write: Promise<{ created: boolean; result: T }>,
): Promise<T> {
  const { created, result } = await write
  if (!created) res.status(200)
  return result
}
