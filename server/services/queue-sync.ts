import type { Knex } from 'knex'

type Trx = Knex | Knex.Transaction
type Kind = 'replace_now' | 'dark' | 'forecast_dark' | 'public_report' | 'certificate_due' | 'rcd_failed'

export interface OpenItem {
  kind: Kind
  subject: string
  severity: 'emergency' | 'standard'
  summary: string
  stringId?: number | null
  reportId?: number | null
  certificateId?: number | null
  siteId?: number | null
  clientId?: number | null
  openedAt?: Date
  dueBy?: Date
}

/** Opens a queue item unless one is already open for the same kind and subject. */
export async function openItem(trx: Trx, item: OpenItem, now = new Date()): Promise<number | null> {
  const openKey = `${item.kind}:${item.subject}`
  const existing = await trx('queueItems').where({ openKey }).first('id')
  if (existing) return existing.id
  let dueBy = item.dueBy
  if (!dueBy && item.clientId) {
    const c = await trx('clients')
      .where({ id: item.clientId })
      .first('responseEmergencyHours', 'responseStandardHours')
    const hours = item.severity === 'emergency' ? c.responseEmergencyHours : c.responseStandardHours
    dueBy = new Date((item.openedAt ?? now).getTime() + hours * 3_600_000)
  }
  const [id] = await trx('queueItems').insert({
    kind: item.kind,
    openKey,
    stringId: item.stringId ?? null,
    reportId: item.reportId ?? null,
    certificateId: item.certificateId ?? null,
    siteId: item.siteId ?? null,
    clientId: item.clientId ?? null,
    severity: item.severity,
    state: 'open',
    openedAt: item.openedAt ?? now,
    dueBy: dueBy ?? new Date(now.getTime() + 36 * 3_600_000),
    summary: item.summary.slice(0, 255),
  })
  return id
}

export async function closeItems(
  trx: Trx,
  where: { stringId: number; kinds: Kind[] },
  visitId: number | null,
  now = new Date(),
) {
  await trx('queueItems')
    .where({ stringId: where.stringId })
    .whereIn('kind', where.kinds)
    .whereIn('state', ['open', 'snoozed'])
    .update({ state: 'closed', openKey: null, closedAt: now, closedByVisitId: visitId })
}

/** Keeps a string's queue items in step with its state: open what it needs, close what a visit fixed. */
export async function syncStringQueue(trx: Trx, stringId: number, visitId: number | null, now = new Date()) {
  const s = await trx('strings as s')
    .join('sites as si', 'si.id', 's.siteId')
    .where('s.id', stringId)
    .first('s.id', 's.assetTag', 's.name', 's.status', 's.lampsOut', 's.siteId', 'si.clientId')
  if (!s) return
  const base = { stringId, siteId: s.siteId, clientId: s.clientId, subject: `string:${stringId}` }
  if (s.status === 'dark') {
    await closeItems(trx, { stringId, kinds: ['replace_now'] }, visitId, now)
    await openItem(
      trx,
      { ...base, kind: 'dark', severity: 'standard', summary: `${s.assetTag} ${s.name} is dark` },
      now,
    )
  } else if (s.status === 'replace') {
    await closeItems(trx, { stringId, kinds: ['dark'] }, visitId, now)
    await openItem(
      trx,
      {
        ...base,
        kind: 'replace_now',
        severity: 'standard',
        summary: `${s.assetTag} ${s.name}: ${s.lampsOut} lamps out, replace now`,
      },
      now,
    )
  } else {
    await closeItems(
      trx,
      { stringId, kinds: ['dark', 'replace_now', 'forecast_dark', 'public_report'] },
      visitId,
      now,
    )
  }
}
