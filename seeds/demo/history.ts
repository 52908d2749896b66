import type { Db } from '../../server/db'
import type { Rng } from './geo'
import { isoDay } from '../../shared/iso-time'

const H = 3_600_000
const D = 24 * H

const stepsOn = ['identify', 'isolate', 'lock_off', 'prove_tester', 'test_dead', 'reprove_tester'] as const
const stepsOff = ['remove_lock', 're_energise', 'functional_check', 'rcd_test'] as const

interface VisitPlan {
  stringId: number
  lat: number
  lng: number
  shunted: boolean
}

/** A season of visits so far: patrol finds, relamps under isolation, a few inspections. */
export async function seedVisits(
  db: Db,
  r: Rng,
  now: Date,
  strings: VisitPlan[],
  crews: { crewId: number; userIds: number[] }[],
) {
  const seasonStart = now.getTime() - 12 * D
  let visits = 0
  const lastVisit = new Map<number, number>()
  for (const s of strings) {
    const count = r.chance(0.55) ? r.int(1, 3) : 0
    const times = Array.from(
      { length: count },
      () => seasonStart + r.next() * (now.getTime() - seasonStart - 3 * H),
    ).sort()
    for (const t0 of times) {
      const crew = r.pick(crews)
      const userId = r.pick(crew.userIds)
      const found = s.shunted ? r.int(0, 3) : r.int(0, 1)
      const relamp = found > 0
      let isolationId: number | null = null
      let noIsolationReason: string | null = null
      const at = new Date(t0)
      // Most relamps are isolated by the crew; a few at pillars another team had already isolated;
      // and a few records have gaps a safety officer should catch (no lock ID, a missing re-prove).
      const byOthers = relamp && r.chance(0.04)
      const sloppy = relamp && !byOthers && r.chance(0.08)
      if (byOthers)
        noIsolationReason = `Isolated at the feeder pillar by the council's electrician, permit ${r.int(4400, 4499)}.`
      if (relamp && !byOthers) {
        const key = `seed-iso-${s.stringId}-${t0}`
        ;[isolationId] = await db('isolations').insert({
          idempotencyKey: key,
          stringId: s.stringId,
          userId,
          crewId: crew.crewId,
          lockId: sloppy && r.chance(0.5) ? null : `LK-${r.int(100, 140)}`,
          testerId: `VT-${r.int(10, 14)}`,
          state: 'restored',
          review: sloppy ? 'pending' : r.chance(0.7) ? 'approved' : 'pending',
          startedAt: at,
          completedAt: new Date(t0 + 40 * 60_000),
        })
        const skip = sloppy ? r.pick(['reprove_tester', 'rcd_test', 'functional_check']) : null
        const steps = [...stepsOn, ...stepsOff]
          .map((step, i) => ({
            isolationId,
            step,
            userId,
            doneAt: new Date(t0 + (i < 6 ? i : 20 + i) * 60_000 + r.int(0, 50) * 1000),
            value: step === 'rcd_test' ? `${r.int(14, 28)} ms` : null,
          }))
          .filter((x) => x.step !== skip)
        await db('isolationSteps').insert(steps)
      }
      await db('visits').insert({
        idempotencyKey: `seed-visit-${s.stringId}-${t0}`,
        stringId: s.stringId,
        userId,
        crewId: crew.crewId,
        isolationId,
        noIsolationReason,
        visitedAt: new Date(t0 + 10 * 60_000),
        failedFound: found,
        replaced: found,
        fuseReplaced: false,
        darkOnArrival: false,
        lampsOutBefore: found,
        lampsOutAfter: 0,
        statusAfter: 'lit',
        notes: relamp
          ? r.pick([
              'Relamped from platform.',
              'Relamped; sockets checked.',
              'Lamps replaced, string tested.',
            ])
          : 'Patrol check: all lit.',
        lat: s.lat,
        lng: s.lng,
        supplyVolts: relamp && r.chance(0.5) ? 228 + r.int(0, 8) : null,
      })
      lastVisit.set(s.stringId, t0 + 10 * 60_000)
      visits++
    }
  }
  for (const [stringId, t] of lastVisit)
    await db('strings')
      .where({ id: stringId })
      .update({ lastVisitAt: new Date(t) })
  return visits
}

export async function seedCertificates(db: Db, r: Rng, now: Date, createdBy: number) {
  const t = now.getTime()
  const rows: Record<string, unknown>[] = []
  const platforms = await db('platforms').select('id', 'assetTag')
  platforms.forEach((p, i) => {
    // LOLER 1998 Schedule 1: thorough examination at least every 6 months for lifting people.
    const done = t - (i === 0 ? 160 : 178) * D
    rows.push({
      kind: 'platform_exam',
      subjectType: 'platform',
      subjectId: p.id,
      reference: `TE-${p.assetTag}-26B`,
      doneOn: isoDay(done),
      nextDue: isoDay(done + 182 * D),
      result: 'pass',
      inspector: 'Fellbeck Lifting Inspections',
      readings: JSON.stringify({ safeWorkingLoadKg: i === 0 ? 320 : 200 }),
    })
  })
  const structures = await db('structures').select('id', 'kind', 'ref')
  structures.forEach((s, i) => {
    // Columns: structural test before hanging, re-test on a 5-year cycle (BS EN 40 practice, client's
    // conditions); anchors: load test at least every 5 years (BS 8539 in one client's conditions).
    // A few fall due within the next fortnight so the queue has something to show.
    const dueSoon = i % 61 === 7
    const due = dueSoon ? t + r.int(3, 13) * D : t + r.int(60, 4 * 365) * D
    const done = due - 5 * 365 * D
    rows.push({
      kind: s.kind === 'column' ? 'column_structural' : 'anchor_test',
      subjectType: 'structure',
      subjectId: s.id,
      reference: `ST-${s.ref}`,
      doneOn: isoDay(done),
      nextDue: isoDay(due),
      result: 'pass',
      inspector: 'Ashlow Structural Testing',
      readings: s.kind === 'anchor' ? JSON.stringify({ proofLoadKn: 6 }) : null,
    })
  })
  const circuits = await db('circuits').select('id', 'ref')
  circuits.forEach((c, i) => {
    const failed = i === 3
    const x1 = r.int(16, 30)
    const x5 = failed ? 52 : r.int(9, 18)
    rows.push({
      kind: 'rcd_test',
      subjectType: 'circuit',
      subjectId: c.id,
      reference: `RCD-${c.ref}`,
      doneOn: isoDay(t - 12 * D),
      nextDue: isoDay(t + 18 * D),
      result: failed ? 'fail' : 'pass',
      inspector: 'Wrenfold Electrical Services',
      readings: JSON.stringify({ ratedMa: 30, tripMsAt1x: x1, tripMsAt5x: x5 }),
      notes: failed ? 'Trip time at 5 × IΔn above 40 ms (BS 7671 reg 415.1.1). Replace RCD.' : null,
    })
    const mohm = i === 7 ? 0.8 : 20 + r.int(0, 180)
    rows.push({
      kind: 'insulation_test',
      subjectType: 'circuit',
      subjectId: c.id,
      reference: `IR-${c.ref}`,
      doneOn: isoDay(t - 13 * D),
      nextDue: isoDay(t + 352 * D),
      result: mohm < 1 ? 'fail' : 'pass',
      inspector: 'Wrenfold Electrical Services',
      readings: JSON.stringify({ testVolts: 500, megohms: mohm }),
    })
  })
  for (let i = 0; i < rows.length; i += 200)
    await db('certificates').insert(rows.slice(i, i + 200).map((x) => ({ ...x, createdBy })))
  return rows.length
}
