import type { Db } from '../db'
import { notFound } from '../errors'
import { iso } from '../../shared/iso-time'

export async function listMail(db: Db) {
  const rows = await db('caughtMail')
    .select('id', 'toAddress', 'subject', 'receivedAt')
    .orderBy('id', 'desc')
    .limit(200)
  return rows.map((r) => ({
    id: r.id,
    to: r.toAddress ?? '',
    subject: r.subject ?? '',
    createdAt: iso(r.receivedAt),
  }))
}

export async function getMail(db: Db, id: number) {
  const r = await db('caughtMail').where({ id }).first()
  if (!r) throw notFound('Message')
  return {
    id: r.id,
    to: r.toAddress ?? '',
    from: r.fromAddress ?? '',
    subject: r.subject ?? '',
    text: r.text ?? '',
    html: r.html ?? null,
    createdAt: iso(r.receivedAt),
  }
}
