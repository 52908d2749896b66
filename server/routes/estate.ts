// The estate's five routes per kind, generated from the kinds' declarations
// (server/services/estate/kinds.ts): list, create, read, update (takes `version`), archive.
//
// Paths the app already answered keep their answers: GET /strings (map), GET /crews and
// GET /string-types answer the paged estate list only when the query has `page`; GET /strings/{id}
// adds the editable row (with `version`) to the string's detail; PATCH /string-types/{id} without
// `version` is the settings page's threshold change (admins). `withEstate` merges each such pair into
// one row, so the OpenAPI document lists every route once.
import { z, type ZodObject, type ZodRawShape } from 'zod'
import { everyone, planners } from '../../shared/roles'
import { idParam } from '../../shared/schemas/common'
import { crewCandidateList, estateListQuery, pageOf, patchOf, rowOf } from '../../shared/schemas/estate'
import { stringTypePatch } from '../../shared/schemas/types'
import { defineRoute, type Ctx, type RouteDef } from '../route-table'
import { badRequest, forbidden } from '../errors'
import { kindDefs, type KindDef } from '../services/estate/kinds'
import { crewCandidates } from '../services/crew-membership'
import { archiveKind, createKind, getOne, listKind, updateKind, type Actor } from '../services/estate/crud'
import { READ_ROW } from './estate-row'

const actor = (ctx: Ctx): Actor => ({
  userId: ctx.user.id,
  role: ctx.user.role,
  requestId: String(ctx.req.id),
})

function kindRoutes(def: KindDef): RouteDef[] {
  const path = `/${def.kind}`
  const row = rowOf(def.body)
  const tag = 'estate'
  return [
    defineRoute({
      method: 'get',
      path,
      access: everyone,
      tag,
      summary: `${def.label}s, paged, searched by q; archived=true|only shows archived ones`,
      query: estateListQuery,
      response: pageOf(row),
      handler: ({ deps, query }) => listKind(deps.db, def, query),
    }),
    defineRoute({
      method: 'post',
      path,
      access: def.write,
      tag,
      summary: `Create a ${def.label.toLowerCase()}`,
      body: def.body,
      response: row,
      status: 201,
      handler: (ctx) => createKind(ctx.deps.db, def, ctx.body as Record<string, unknown>, actor(ctx)),
    }),
    defineRoute({
      method: 'get',
      path: `${path}/:id`,
      access: everyone,
      tag,
      summary: `One ${def.label.toLowerCase()} with its version`,
      params: idParam,
      response: row,
      handler: ({ deps, params, res }) => getOne(deps.db, def, params.id, res.locals[READ_ROW]),
    }),
    defineRoute({
      method: 'patch',
      path: `${path}/:id`,
      access: def.write,
      tag,
      summary: `Change a ${def.label.toLowerCase()}; a stale version answers 409 edit_conflict with the current row`,
      params: idParam,
      body: patchOf(def.body),
      response: row,
      handler: (ctx) =>
        updateKind(ctx.deps.db, def, ctx.params.id, ctx.body as Record<string, unknown>, actor(ctx)),
    }),
    defineRoute({
      method: 'delete',
      path: `${path}/:id`,
      access: def.write,
      tag,
      summary: `Archive a ${def.label.toLowerCase()} (never deleted: its history stays)`,
      params: idParam,
      response: row,
      handler: (ctx) => archiveKind(ctx.deps.db, def, ctx.params.id, actor(ctx)),
    }),
  ]
}

// The estate list's fields on a path that answers something else without them: no defaults here, so
// a request without `page` is the old route's.
const optionalList = z.object({
  page: z.coerce.number().int().min(1).optional(),
  pageSize: z.coerce.number().int().min(1).max(200).optional(),
  q: z.string().trim().max(100).optional(),
  archived: z.enum(['false', 'true', 'only']).optional(),
})

/** One row answering both the route the app had and the estate's route on the same path. */
function merge(old: RouteDef, est: RouteDef): RouteDef {
  if (est.method === 'get' && !est.path.endsWith('/:id'))
    return {
      ...old,
      summary: `${old.summary}; with page=, the estate list ({ items, total })`,
      query: old.query
        ? (old.query as ZodObject<ZodRawShape>).extend(optionalList.omit({ q: true }).shape)
        : optionalList,
      response: z.union([old.response!, est.response!]),
      handler: (ctx) => {
        const q = ctx.query as Record<string, unknown>
        if (q.page === undefined) return old.handler(ctx)
        return est.handler({ ...ctx, query: estateListQuery.parse(ctx.req.query) })
      },
    }
  if (est.method === 'get')
    return {
      ...old,
      summary: `${old.summary}, with the editable fields and version`,
      handler: async (ctx) => ({
        ...((await old.handler(ctx)) as object),
        ...((await est.handler(ctx)) as object),
      }),
    }
  // PATCH /string-types/{id}: with `version` the estate's edit, without it the threshold change.
  return {
    ...old,
    access: est.access,
    summary: `${old.summary} (admins); with version, any field (estate edit)`,
    body: (est.body as ZodObject<ZodRawShape>).partial({ version: true }),
    response: z.union([old.response!, est.response!]),
    handler: (ctx) => {
      const body = ctx.body as Record<string, unknown>
      if (body.version !== undefined) return est.handler(ctx)
      if (!old.access.includes(ctx.user.role)) throw forbidden()
      const legacy = stringTypePatch.safeParse(ctx.req.body)
      if (!legacy.success)
        throw badRequest('validation_failed', 'Send the version you loaded.', {
          fields: [{ path: 'body.version', message: 'Required.' }],
        })
      return old.handler({ ...ctx, body: legacy.data })
    },
  }
}

const candidatesRoute = defineRoute({
  method: 'get',
  path: '/crew-members',
  access: planners,
  tag: 'estate',
  summary: 'Users who can be put on a crew (crew members and supervisors) and the crew each is on',
  response: crewCandidateList,
  handler: ({ deps }) => crewCandidates(deps.db),
})

const same = (a: RouteDef, b: RouteDef) => a.method === b.method && a.path === b.path

/** The app's routes with the estate's added, each path and method once. */
export function withEstate(base: RouteDef[]): RouteDef[] {
  const estate = kindDefs.flatMap(kindRoutes)
  const merged = base.map((r) => {
    const e = estate.find((x) => same(x, r))
    return e ? merge(r, e) : r
  })
  return [...merged, ...estate.filter((e) => !base.some((r) => same(r, e))), candidatesRoute]
}
