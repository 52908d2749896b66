// Who may see and move which stock. Planners (supervisor, manager, admin) see and move all of it. A
// crew member sees only their own crew's van, may load it from the depot or put stock back there,
// and may correct its count; never another van, never the depot's own count.
import { forbidden } from '../errors'
import type { Role } from '../../shared/roles'
import { only } from '../../shared/roles'
import type { Place } from './stock-places'

export interface StockUser {
  id: number
  role: Role
  crewId: number | null
}

const isCrew = (u: StockUser) => only.crew.includes(u.role)
const ownVan = (u: StockUser, p: Place) => p.kind === 'van' && u.crewId !== null && p.crewId === u.crewId

/** The crew a crew member's read is narrowed to (null: not narrowed). Refuses any other place. */
export function readScope(u: StockUser, ask: { crewId?: number; place?: Place }): number | null {
  if (!isCrew(u)) return null
  if (u.crewId === null) throw forbidden('You are not on a crew yet, so you have no van.')
  if (ask.crewId !== undefined && ask.crewId !== u.crewId) throw forbidden('You can see only your own van.')
  if (ask.place && !ownVan(u, ask.place)) throw forbidden('You can see only your own van.')
  return u.crewId
}

export function checkTransfer(u: StockUser, from: Place, to: Place): void {
  if (!isCrew(u)) return
  const ok = (ownVan(u, from) && to.kind === 'depot') || (from.kind === 'depot' && ownVan(u, to))
  if (!ok) throw forbidden('A crew moves stock only between the depot and its own van.')
}

export function checkAdjust(u: StockUser, place: Place): void {
  if (isCrew(u) && !ownVan(u, place)) throw forbidden('A crew corrects only its own van’s count.')
}
