import type { Db } from '../db'
import type { Mailer } from '../mail/mailer'
import type { Config } from '../config'
import { planRunsInPool, type JobOwner } from '../workers/heavy-jobs'
import { audit } from './audit'
import type { PlanResult } from '../../shared/routing/plan-types'
import type { CrewRun, PlanBody, PlanResultView } from '../../shared/schemas/runs'
import { loadCrews, type CrewInfo, type ItemInfo } from './run-items'
import { preparePlan } from './plan-input'
import { runMail } from '../mail/run-mail'
import { listRuns } from './run-list'
import { markReportsScheduled } from './queue/report-states'
import { noticeRunPublished, runStopItems } from './notice-producers'
import { withStockWarnings } from './stock-forecast'

function view(
  date: string,
  crew: CrewInfo,
  planned: PlanResult['runs'][number] | undefined,
  items: Map<number, ItemInfo>,
  pinned: Set<number>,
): CrewRun {
  return {
    id: null,
    crewId: crew.id,
    crewName: crew.name,
    date,
    state: 'proposal',
    version: 0,
    publishedAt: null,
    depot: { name: crew.depotName, lat: crew.depotLat, lng: crew.depotLng },
    shiftStart: crew.shiftStart,
    shiftEnd: crew.shiftEnd,
    platform: crew.platform ? `${crew.platform.assetTag} ${crew.platform.name}` : null,
    stops: (planned?.stops ?? []).map((s) => {
      const it = items.get(Number(s.itemId))!
      return {
        itemId: it.itemId,
        kind: it.kind as CrewRun['stops'][number]['kind'],
        summary: it.summary,
        stringId: it.stringId,
        assetTag: it.assetTag,
        siteName: it.siteName,
        lat: it.lat,
        lng: it.lng,
        arrive: s.arrive,
        start: s.start,
        depart: s.depart,
        travelMinutes: s.travelMinutes,
        serviceMinutes: it.serviceMinutes,
        pinned: pinned.has(it.itemId),
        window: it.window,
        doneAt: null,
        emergency: it.emergency,
      }
    }),
    returnAt: planned?.returnAt ?? crew.shiftStart,
    totalTravelMinutes: planned?.totalTravelMinutes ?? 0,
    totalServiceMinutes: planned?.totalServiceMinutes ?? 0,
  }
}

/** Assigns the chosen queue items to the chosen crews and orders each run; nothing is saved. */
export async function proposePlan(
  db: Db,
  body: PlanBody,
  config: Pick<Config, 'ROUTING_URL'> = {},
  owner?: JobOwner,
): Promise<PlanResultView> {
  const { input, crews, items, refused, platformNotes, travelSource, pinned } = await preparePlan(
    db,
    body,
    config,
  )
  // Seconds for the largest plan (50 crews, 500 items: about 6.5 s): on a worker thread, not the event loop.
  const result = await planRunsInPool(input, owner)
  return {
    date: body.date,
    travelSource,
    // Each run warns when its stops need more lamps of a class than its van holds (stock-forecast.ts).
    runs: await withStockWarnings(
      db,
      crews.map((c) =>
        view(
          body.date,
          c,
          result.runs.find((r) => r.crewId === String(c.id)),
          items,
          pinned,
        ),
      ),
    ),
    unassigned: [
      ...refused,
      ...result.unassigned.map((u) => ({
        itemId: Number(u.itemId),
        summary: items.get(Number(u.itemId))!.summary,
        reason: u.reason,
        message:
          u.reason === 'needs_platform' && platformNotes.length
            ? `${u.message} ${platformNotes.join(' ')}`
            : u.message,
      })),
    ],
  }
}

/** Saves each crew's run in the order given, times it, and tells the crew by e-mail (new or changed). */
export async function publishRuns(
  db: Db,
  mailer: Mailer,
  config: Config,
  userId: number,
  body: {
    date: string
    runs: { crewId: number; itemIds: number[] }[]
    pinnedItemIds?: number[]
    speedKmh?: number
    detourFactor?: number
  },
  ctx: { requestId?: string; owner?: JobOwner } = {},
) {
  // Every stop is fixed in the order given so the saved run is timed as published; only the stops the
  // supervisor pinned are saved pinned, so a later re-optimise may still move the others.
  const supervisorPins = new Set(body.pinnedItemIds ?? [])
  const plan = await proposePlan(
    db,
    {
      date: body.date,
      crewIds: body.runs.map((r) => r.crewId),
      itemIds: [...new Set(body.runs.flatMap((r) => r.itemIds))],
      pins: body.runs.flatMap((r) => r.itemIds.map((itemId, index) => ({ itemId, crewId: r.crewId, index }))),
      speedKmh: body.speedKmh,
      detourFactor: body.detourFactor,
    },
    config,
    ctx.owner,
  )
  const now = new Date()
  const notices: { crewId: number; changed: boolean }[] = []
  await db.transaction(async (trx) => {
    const runIds: number[] = []
    for (const run of plan.runs) {
      const prev = await trx('runs')
        .where({ crewId: run.crewId, runDate: body.date })
        .first('id', 'version', 'state')
      const before = prev ? await runStopItems(trx, prev.id) : []
      const row = {
        state: 'published',
        publishedAt: now,
        publishedBy: userId,
        totalTravelMinutes: run.totalTravelMinutes,
        totalServiceMinutes: run.totalServiceMinutes,
        returnAt: run.returnAt,
      }
      let runId: number
      if (prev) {
        runId = prev.id
        await trx('runs')
          .where({ id: runId })
          .update({ ...row, version: prev.version + 1 })
        await trx('runStops').where({ runId }).delete()
      } else {
        ;[runId] = await trx('runs').insert({ ...row, crewId: run.crewId, runDate: body.date, version: 1 })
      }
      if (run.stops.length) {
        await trx('runStops').insert(
          run.stops.map((s, i) => ({
            runId,
            position: i + 1,
            queueItemId: s.itemId,
            stringId: s.stringId,
            arriveAt: s.arrive,
            startAt: s.start,
            departAt: s.depart,
            travelMinutes: s.travelMinutes,
            serviceMinutes: s.serviceMinutes,
            pinned: s.itemId !== null && supervisorPins.has(s.itemId),
          })),
        )
      }
      notices.push({ crewId: run.crewId, changed: prev?.state === 'published' })
      await noticeRunPublished(trx, {
        crewId: run.crewId,
        date: body.date,
        wasPublished: prev?.state === 'published',
        before,
        after: run.stops.map((s) => Number(s.itemId)),
        publishedBy: userId,
      })
      runIds.push(runId)
    }
    // The public reports these runs will see to read "scheduled" from this commit.
    await markReportsScheduled(trx, runIds, now)
    await audit(trx, {
      userId,
      action: 'publish',
      entity: 'run',
      details: { date: body.date, crews: body.runs.map((r) => r.crewId) },
      requestId: ctx.requestId,
    })
  })
  const saved = await listRuns(db, body.date)
  for (const n of notices) {
    const run = saved.find((r) => r.crewId === n.crewId)!
    const crew = (await loadCrews(db, [n.crewId]))[0]
    for (const m of crew.members) await mailer.send(runMail(config, m, run, n.changed))
  }
  const runs = await withStockWarnings(db, saved)
  return { date: body.date, travelSource: plan.travelSource, runs, unassigned: plan.unassigned }
}
