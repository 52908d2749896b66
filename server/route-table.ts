// Every API route is one row of a table: method, path, who may call it, its zod schemas and a
// handler. The same rows mount the Express routes and generate the OpenAPI document, so neither
// can drift from the other.
import type { Request, Response, RequestHandler, Router } from 'express'
import type { z, ZodType } from 'zod'
import type { Role } from '../shared/roles'
import { requireRoles } from './middleware/require-role'
import { validate } from './middleware/validate'
import { idempotencyCheck, type Idempotency } from './middleware/idempotency'
import type { AppDeps } from './deps'

export type Access = readonly Role[] | 'public'

export interface Ctx<B = unknown, Q = unknown, P = unknown, K = string | null> {
  req: Request
  res: Response
  body: B
  query: Q
  params: P
  /** The checked Idempotency-Key header on routes that declare `idempotency`, else null. */
  idempotencyKey: K
  user: NonNullable<Request['user']>
  deps: AppDeps
}

export interface RouteDef {
  method: 'get' | 'post' | 'patch' | 'put' | 'delete'
  path: string
  access: Access
  summary: string
  tag: string
  body?: ZodType
  bodyType?: 'json' | 'multipart'
  query?: ZodType
  params?: ZodType
  response?: ZodType
  /** A response that is not JSON (image, PDF, HTML): its content type for the document. */
  responseType?: string
  status?: number
  before?: (deps: AppDeps) => RequestHandler[]
  /** 'handler': `body` documents the route but the handler validates it (a large body, checked on a
   * worker thread); the handler then gets the raw body. */
  bodyCheck?: 'handler'
  /** The route takes an Idempotency-Key header: checked before the body, listed in the document. */
  idempotency?: Idempotency
  handler: (ctx: Ctx) => Promise<unknown> | unknown
}

type Out<S> = S extends ZodType ? z.output<S> : undefined

type KeyOf<I> = I extends 'required' ? string : I extends 'optional' ? string | null : null

type RouteSpec<B, Q, P, I> = Omit<RouteDef, 'handler' | 'body' | 'query' | 'params' | 'idempotency'> & {
  body?: B
  query?: Q
  params?: P
  idempotency?: I
  handler: (ctx: Ctx<Out<B>, Out<Q>, Out<P>, KeyOf<I>>) => Promise<unknown> | unknown
}

/**
 * One row of a route table, with the handler's body, query and params typed from its zod schemas
 * (and its idempotency key a string where the row requires one).
 */
export function defineRoute<
  B extends ZodType | undefined = undefined,
  Q extends ZodType | undefined = undefined,
  P extends ZodType | undefined = undefined,
  I extends Idempotency | undefined = undefined,
>(spec: RouteSpec<B, Q, P, I>): RouteDef {
  return spec as unknown as RouteDef
}

export function mountRoutes(router: Router, defs: RouteDef[], deps: AppDeps): void {
  for (const def of defs) {
    const chain: RequestHandler[] = []
    if (def.access !== 'public') chain.push(requireRoles(def.access))
    if (def.idempotency) chain.push(idempotencyCheck(def.idempotency))
    if (def.before) chain.push(...def.before(deps))
    chain.push(validate(def.bodyCheck === 'handler' ? { query: def.query, params: def.params } : def))
    chain.push(async (req, res) => {
      const v = res.locals.valid as { body: unknown; query: unknown; params: unknown }
      // The table's status unless the handler sets its own (503 from the health check, 200 for a replay).
      res.status(def.status ?? 200)
      const idempotencyKey = (res.locals.idempotencyKey as string | undefined) ?? null
      const result = await def.handler({ req, res, ...v, idempotencyKey, user: req.user!, deps })
      if (res.headersSent) return
      if (result !== undefined) res.json(result)
      else res.status(res.statusCode === 200 && !def.status ? 204 : res.statusCode).end()
    })
    router[def.method](def.path, ...chain)
  }
}
