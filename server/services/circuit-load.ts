// A circuit's load from the strings on it: running current against the breaker with the 80 %
// continuous margin, switch-on peak against the curve's instantaneous band, RCD, energy and cost.
import type { Db } from '../db'
import { notFound } from '../errors'
import { assessCircuit, stringLoad } from '../../shared/engine/index'
import { conditionOf, engineInput } from '../../shared/string-status'
import { burnHoursPerDay, seasonNights } from '../../shared/schedule'
import { loadType, type StringType } from './strings'

export async function circuitLoad(db: Db, circuitId: number) {
  const c = await db('circuits as ci')
    .join('supplyPoints as sp', 'sp.id', 'ci.supplyPointId')
    .join('sites as si', 'si.id', 'sp.siteId')
    .join('clients as cl', 'cl.id', 'si.clientId')
    .where('ci.id', circuitId)
    .first(
      'ci.id',
      'ci.ref',
      'ci.supplyVolts',
      'ci.breakerAmps',
      'ci.breakerCurve',
      'ci.rcdMa',
      'cl.switchOn',
      'cl.switchOff',
      'cl.seasonStart',
      'cl.seasonEnd',
      'cl.tariffPerKwh',
    )
  if (!c) throw notFound('Circuit')
  const strings = await db('strings')
    .where({ circuitId })
    .select('id', 'typeId', 'lampsOut', 'fuseFailed', 'dark', 'isolated', 'lampAgeHours')
  const types = new Map<number, StringType>()
  const loads = []
  for (const s of strings) {
    if (!types.has(s.typeId)) types.set(s.typeId, await loadType(db, s.typeId))
    const type = types.get(s.typeId)!
    if (s.isolated) continue
    const load = stringLoad({
      ...engineInput(type, conditionOf(s), type.supplyVolts),
      technology: type.technology,
    })
    // A string fed at another voltage (a 24 V curtain's driver) draws its power from the circuit's supply.
    const scale = type.supplyVolts / c.supplyVolts
    loads.push({ runningAmps: load.runningAmps * scale, peakAmps: load.peakAmps * scale, watts: load.watts })
  }
  const seasonDays = seasonNights(c.seasonStart, c.seasonEnd) ?? undefined
  const result = loads.length
    ? assessCircuit({
        supplyVolts: c.supplyVolts,
        breakerAmps: c.breakerAmps,
        curve: c.breakerCurve,
        rcdMilliamps: c.rcdMa ?? undefined,
        strings: loads,
        burnHoursPerDay: burnHoursPerDay(c.switchOn, c.switchOff),
        seasonDays,
        tariffPerKwh: c.tariffPerKwh,
      })
    : null
  return {
    circuitId: c.id,
    ref: c.ref,
    stringCount: strings.length,
    energised: loads.length,
    seasonDays: seasonDays ?? null,
    result,
  }
}
