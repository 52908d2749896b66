// A circuit's load from the strings on it: running current against the breaker (80 % continuous
// margin, and its rating), switch-on peak against the curve's instantaneous band, the RCD (type,
// additional protection, standing leakage from the newest RCD test), energy and cost.
import type { Db } from '../db'
import { notFound } from '../errors'
import { assessCircuit, stringLoad } from '../../shared/engine/index'
import type { CircuitString } from '../../shared/schemas/engine'
import { conditionOf, engineInput } from '../../shared/string-status'
import { burnHoursPerDay, seasonNights } from '../../shared/schedule'
import { loadType, type StringType } from './strings'
import { stringRecordColumns } from './string-engine'

/** LED driver switch-on data a string type may carry (null or absent: not known). */
type DriverData = { inrushPeakAmps?: number | null; inrushMs?: number | null }

/** One energised string as the circuit sees it. */
function circuitString(type: StringType, s: Parameters<typeof conditionOf>[0], circuitVolts: number) {
  const driver = type as DriverData
  const led = type.technology === 'led'
  const load = stringLoad({
    ...engineInput(type, conditionOf(s), type.supplyVolts),
    technology: type.technology,
    ...(led && driver.inrushPeakAmps != null ? { inrushPeakAmps: driver.inrushPeakAmps } : {}),
    ...(led && driver.inrushMs != null ? { inrushMs: driver.inrushMs } : {}),
  })
  // A string fed at another voltage (a 24 V curtain's driver) draws its power from the circuit's
  // supply: the same volt-amperes at the circuit's voltage. For an LED string the engine's running
  // amps are VA / V (watts / power factor), so the breaker sees the apparent current; the energy
  // stays the real watts.
  const scale = type.supplyVolts / circuitVolts
  const out: CircuitString = {
    runningAmps: load.runningAmps * scale,
    peakAmps: load.peakAmps * scale,
    watts: load.watts,
  }
  // A driver's inrush is stated at its mains input: it is the circuit's current as it stands.
  if (led && driver.inrushPeakAmps != null) out.peakAmps = Math.max(driver.inrushPeakAmps, out.runningAmps)
  if (load.peakMs != null && load.peakMs > 0) out.peakMs = load.peakMs
  if (!load.surgeKnown) out.surgeKnown = false
  return out
}

/** Standing leakage recorded with the circuit's newest RCD test, if it was measured. */
async function measuredLeakage(db: Db, circuitId: number): Promise<number | undefined> {
  const row = await db('certificates')
    .where({ kind: 'rcd_test', subjectType: 'circuit', subjectId: circuitId })
    .orderBy('id', 'desc')
    .first('readings')
  let readings: unknown = row?.readings
  try {
    if (typeof readings === 'string') readings = JSON.parse(readings)
  } catch {
    return undefined
  }
  const ma = (readings as { leakageMa?: unknown } | null)?.leakageMa
  return typeof ma === 'number' && ma >= 0 ? ma : undefined
}

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
      'ci.rcdType',
      'cl.switchOn',
      'cl.switchOff',
      'cl.seasonStart',
      'cl.seasonEnd',
      'cl.tariffPerKwh',
    )
  if (!c) throw notFound('Circuit')
  const strings = await db('strings')
    .where({ circuitId })
    .select(...stringRecordColumns('strings'))
  const types = new Map<number, StringType>()
  const loads: CircuitString[] = []
  for (const s of strings) {
    if (!types.has(s.typeId)) types.set(s.typeId, await loadType(db, s.typeId))
    if (!s.isolated) loads.push(circuitString(types.get(s.typeId)!, s, c.supplyVolts))
  }
  const seasonDays = seasonNights(c.seasonStart, c.seasonEnd) ?? undefined
  const result = loads.length
    ? assessCircuit({
        supplyVolts: c.supplyVolts,
        breakerAmps: c.breakerAmps,
        curve: c.breakerCurve,
        rcdMilliamps: c.rcdMa ?? undefined,
        // Older rows without a type are general type, as the migration that added it set them.
        rcdType: c.rcdType === 'S' ? 'S' : 'general',
        leakageMilliamps: c.rcdMa ? await measuredLeakage(db, circuitId) : undefined,
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
