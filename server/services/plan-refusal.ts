// What the planner refuses before its solver runs (and publishing, which plans again, re-checks):
//   - a platform whose newest thorough examination has failed, has expired by the run's date, or is
//     not on record (a platform lifting people is examined at least every 6 months, LOLER 1998
//     Schedule 1; trade-reference §7): the crew goes out without it, so work that needs a platform
//     goes to a crew whose platform is in date, or stays off with the platform named;
//   - a string hung on a column or anchor whose newest structural approval (column structural test,
//     anchor load test) has failed, has expired by the run's date, or is not on record (BS EN 40
//     column test before attaching, BS 8539 anchor load test; trade-reference §7).
// Refused items stay in the queue and are listed as not on any run, with the reason in words.
import type { Db } from '../db'
import type { CrewInfo, ItemInfo } from './run-items'
import { lapse, newestCertificates as newest, STRUCTURAL_APPROVAL } from './certificate-approvals'

export const REFUSAL_REASONS = ['platform_not_examined', 'structure_not_approved'] as const
export type RefusalReason = (typeof REFUSAL_REASONS)[number]

export interface Refused {
  itemId: number
  summary: string
  reason: RefusalReason
  message: string
}

/**
 * Takes refused platforms off their crews and refused items out of the plan. Answers the crews and
 * items to plan, the refused items, and a note per refused platform for work left needing one.
 */
export async function applyRefusals(
  db: Db,
  crews: CrewInfo[],
  items: Map<number, ItemInfo>,
  date: string,
): Promise<{ crews: CrewInfo[]; items: Map<number, ItemInfo>; refused: Refused[]; platformNotes: string[] }> {
  const platformIds = crews.map((c) => c.platform?.id).filter((id): id is number => !!id)
  const exams = await newest(db, ['platform_exam'], 'platform', platformIds)
  const platformNotes: string[] = []
  const planCrews = crews.map((c) => {
    if (!c.platform) return c
    const why = lapse(exams.get(c.platform.id), date, 'thorough examination')
    if (!why) return c
    platformNotes.push(`Platform ${c.platform.assetTag} (${c.platform.name}, crew ${c.name}): ${why}.`)
    return { ...c, platform: null }
  })
  const refused: Refused[] = []
  const keep = new Map(items)
  // With every chosen platform refused, work that needs one cannot go out at all.
  if (platformNotes.length && !planCrews.some((c) => c.platform))
    for (const it of items.values())
      if (it.needsPlatform) {
        refused.push({
          itemId: it.itemId,
          summary: it.summary,
          reason: 'platform_not_examined',
          message: `Needs a platform, and none may go out. ${platformNotes.join(' ')}`,
        })
        keep.delete(it.itemId)
      }
  const stringIds = [...keep.values()].map((i) => i.stringId).filter((id): id is number => !!id)
  const hung = stringIds.length
    ? await db('strings as s')
        .join('structures as st', 'st.id', 's.structureId')
        .whereIn('s.id', stringIds)
        .whereIn('st.kind', ['column', 'anchor'])
        .select('s.id as stringId', 'st.id', 'st.kind', 'st.ref')
    : []
  const approvals = await newest(
    db,
    [...STRUCTURAL_APPROVAL.kinds],
    'structure',
    hung.map((h) => h.id as number),
  )
  const byString = new Map(hung.map((h) => [h.stringId as number, h]))
  for (const it of [...keep.values()]) {
    const st = it.stringId ? byString.get(it.stringId) : undefined
    if (!st) continue
    const what = STRUCTURAL_APPROVAL.what(st.kind)
    const why = lapse(approvals.get(st.id), date, what)
    if (!why) continue
    refused.push({
      itemId: it.itemId,
      summary: it.summary,
      reason: 'structure_not_approved',
      message: `Hung on ${st.kind} ${st.ref}, which has no valid structural approval: ${why}.`,
    })
    keep.delete(it.itemId)
  }
  return { crews: planCrews, items: keep, refused, platformNotes }
}
