import type { Db } from '../db'
import { listQueue } from './queue/list'

/** Items within this many hours of their contract deadline count as due soon. */
export const DUE_SOON_HOURS = 12

/** Open work against each client's contract response times: what is late and what soon will be. */
export async function overdueReport(db: Db, now = new Date()) {
  const items = await listQueue(db, { state: 'active' }, now)
  const clients = await db('clients')
    .orderBy('name')
    .select('id', 'name', 'contractRef', 'responseEmergencyHours', 'responseStandardHours')
  return {
    generatedAt: now.toISOString(),
    dueSoonHours: DUE_SOON_HOURS,
    clients: clients.map((c) => {
      const mine = items.filter((i) => i.client?.id === c.id)
      const late = mine.filter((i) => i.overdue)
      const soon = mine.filter((i) => !i.overdue && i.hoursLeft <= DUE_SOON_HOURS)
      return {
        id: c.id,
        name: c.name,
        contractRef: c.contractRef ?? null,
        emergencyHours: c.responseEmergencyHours,
        standardHours: c.responseStandardHours,
        open: mine.length,
        overdue: late.length,
        dueSoon: soon.length,
        items: [...late, ...soon].sort((a, b) => a.hoursLeft - b.hoursLeft),
      }
    }),
  }
}
