// The OpenAPI document, generated from the same route tables that Express mounts.
import { OpenAPIRegistry, OpenApiGeneratorV31, extendZodWithOpenApi } from '@asteasolutions/zod-to-openapi'
import { z, type ZodType } from 'zod'
import { errorSchema } from '../shared/schemas/common'
import type { RouteDef } from './route-table'
import { idempotencyHeaders } from './middleware/idempotency'

extendZodWithOpenApi(z)

export const API_PREFIX = '/api/v1'

export const openApiPath = (path: string) => API_PREFIX + path.replace(/:([A-Za-z]+)/g, '{$1}')

export function buildOpenApi(defs: RouteDef[]) {
  const registry = new OpenAPIRegistry()
  registry.registerComponent('securitySchemes', 'bearer', {
    type: 'http',
    scheme: 'bearer',
    bearerFormat: 'JWT',
  })
  registry.registerComponent('securitySchemes', 'cookie', {
    type: 'apiKey',
    in: 'cookie',
    name: 'lw_session',
  })
  const errorBody = { description: 'Error', content: { 'application/json': { schema: errorSchema } } }
  for (const d of defs) {
    const ok = d.status ?? (d.response || d.responseType ? 200 : 204)
    const responses: Record<string, unknown> = {
      [ok]: d.responseType
        ? {
            description: 'OK',
            content: { [d.responseType]: { schema: { type: 'string', format: 'binary' } } },
          }
        : d.response
          ? { description: 'OK', content: { 'application/json': { schema: d.response } } }
          : { description: 'No content' },
      400: errorBody,
    }
    if (d.access !== 'public') Object.assign(responses, { 401: errorBody, 403: errorBody })
    const body = d.body as ZodType | undefined
    registry.registerPath({
      method: d.method,
      path: openApiPath(d.path),
      summary: d.summary,
      tags: [d.tag],
      security: d.access === 'public' ? [] : [{ bearer: [] }, { cookie: [] }],
      request: {
        params: d.params as never,
        query: d.query as never,
        headers: d.idempotency ? idempotencyHeaders(d.idempotency) : undefined,
        body: body
          ? {
              content: {
                [d.bodyType === 'multipart' ? 'multipart/form-data' : 'application/json']: { schema: body },
              },
            }
          : undefined,
      },
      responses: responses as never,
      'x-roles': d.access === 'public' ? ['public'] : [...d.access],
    })
  }
  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Lampwright API',
      version: '1.0.0',
      description:
        'Field maintenance and fault log for festive lighting. Errors: { error: { code, message, details? } }.',
    },
    servers: [{ url: '/' }],
  })
}
