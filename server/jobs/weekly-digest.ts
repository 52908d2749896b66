// The managers' weekly digest: for the seven days to `now`, per client, the faults past their
// contract time, the hours strings were known dark, faults found and fixed, lamps replaced; and the
// certificates overdue or falling due. Sent to every active manager through the mailer (outbox).
import type { Db } from '../db'
import type { Mailer } from '../mail/mailer'
import type { Config } from '../config'
import { FAULT_KINDS } from '../services/client-report'
import { listCertificates } from '../services/certificates'
import { ACTIVE } from '../services/queue/items'
import { digestMail } from './weekly-digest-mail'

const HOUR = 3_600_000
export const DIGEST_DAYS = 7
/** Certificates falling due within this many days are listed (listCertificates' "soon"). */
export const DIGEST_CERT_DAYS = 30

export interface DigestClient {
  id: number
  name: string
  overdueNow: number
  darkHours: number
  faultsFound: number
  faultsFixed: number
  lampsReplaced: number
}

export interface Digest {
  from: Date
  to: Date
  clients: DigestClient[]
  totals: Omit<DigestClient, 'id' | 'name'>
  certificates: {
    overdue: number
    failed: number
    soon: { label: string; kind: string; nextDue: string }[]
  }
}

type Count = { clientId: number | null; n: number | string | null }
const byClient = (rows: Count[]) => new Map(rows.map((r) => [r.clientId, Number(r.n ?? 0)]))

export async function weeklyDigest(db: Db, now = new Date()): Promise<Digest> {
  const from = new Date(now.getTime() - DIGEST_DAYS * 24 * HOUR)
  const clients: { id: number; name: string }[] = await db('clients').orderBy('name').select('id', 'name')
  const overdue = byClient(
    await db('queueItems')
      .whereIn('state', ACTIVE)
      .where('dueBy', '<', now)
      .groupBy('clientId')
      .select('clientId', db.raw('count(*) as n')),
  )
  const found = byClient(
    await db('queueItems')
      .whereIn('kind', FAULT_KINDS)
      .where('openedAt', '>=', from)
      .where('openedAt', '<', now)
      .groupBy('clientId')
      .select('clientId', db.raw('count(*) as n')),
  )
  const fixed = byClient(
    await db('queueItems')
      .whereIn('kind', FAULT_KINDS)
      .where({ state: 'closed' })
      .where('closedAt', '>=', from)
      .where('closedAt', '<', now)
      .groupBy('clientId')
      .select('clientId', db.raw('count(*) as n')),
  )
  const lamps = byClient(
    await db('visits as v')
      .join('strings as s', 's.id', 'v.stringId')
      .join('sites as si', 'si.id', 's.siteId')
      .where('v.visitedAt', '>=', from)
      .where('v.visitedAt', '<', now)
      .groupBy('si.clientId')
      .select('si.clientId', db.raw('sum(v.replaced) as n')),
  )
  // A dark item counts from its opening to its closing (or now), clipped to the week.
  const darkRows: { clientId: number | null; openedAt: Date; closedAt: Date | null }[] = await db(
    'queueItems',
  )
    .where({ kind: 'dark' })
    .where('openedAt', '<', now)
    .where((q) => q.whereNull('closedAt').orWhere('closedAt', '>', from))
    .select('clientId', 'openedAt', 'closedAt')
  const dark = new Map<number | null, number>()
  for (const r of darkRows) {
    const ms = Math.min(+(r.closedAt ?? now), +now) - Math.max(+r.openedAt, +from)
    if (ms > 0) dark.set(r.clientId, (dark.get(r.clientId) ?? 0) + ms / HOUR)
  }
  const list = clients.map((c) => ({
    id: c.id,
    name: c.name,
    overdueNow: overdue.get(c.id) ?? 0,
    darkHours: Math.round((dark.get(c.id) ?? 0) * 10) / 10,
    faultsFound: found.get(c.id) ?? 0,
    faultsFixed: fixed.get(c.id) ?? 0,
    lampsReplaced: lamps.get(c.id) ?? 0,
  }))
  const sum = (k: keyof Digest['totals']) => list.reduce((a, c) => a + c[k], 0)
  const [late, failed, soon] = await Promise.all([
    listCertificates(db, { due: 'overdue', limit: 10_000 }, now),
    listCertificates(db, { due: 'failed', limit: 10_000 }, now),
    listCertificates(db, { due: 'soon', limit: 20 }, now),
  ])
  return {
    from,
    to: now,
    clients: list,
    totals: {
      overdueNow: sum('overdueNow'),
      darkHours: Math.round(sum('darkHours') * 10) / 10,
      faultsFound: sum('faultsFound'),
      faultsFixed: sum('faultsFixed'),
      lampsReplaced: sum('lampsReplaced'),
    },
    certificates: {
      overdue: late.length,
      failed: failed.length,
      soon: soon.map((c) => ({ label: c.subjectLabel, kind: c.kind, nextDue: c.nextDue ?? '' })),
    },
  }
}

/** Works out the digest and mails it to every active manager; answers what was sent. */
export async function sendWeeklyDigest(db: Db, mailer: Mailer, config: Config, now = new Date()) {
  const digest = await weeklyDigest(db, now)
  const managers: { email: string; name: string }[] = await db('users')
    .where({ role: 'manager', active: true })
    .orderBy('id')
    .select('email', 'name')
  for (const m of managers) await mailer.send(digestMail(config, m, digest))
  return { recipients: managers.length, totals: digest.totals, certificates: digest.certificates.overdue }
}
