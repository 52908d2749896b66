// The parts of autocannon (no types of its own) that scripts/bench/api.ts uses.
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events'

  export interface Request {
    method?: string
    path?: string
    headers?: Record<string, string>
    body?: string
  }
  export interface RequestStep extends Request {
    setupRequest?: (req: Request, context: Record<string, unknown>) => Request
  }
  export interface Options {
    url: string
    connections?: number
    duration?: number
    method?: string
    headers?: Record<string, string>
    body?: string
    requests?: RequestStep[]
    timeout?: number
  }
  export interface Histogram {
    average: number
    p50: number
    p99: number
  }
  export interface Result {
    duration: number
    requests: Histogram & { total: number }
    latency: Histogram
    errors: number
    timeouts: number
    non2xx: number
    statusCodeStats: Record<string, { count: number }>
  }
  export interface Instance extends EventEmitter, PromiseLike<Result> {
    stop(): void
  }
  function autocannon(opts: Options): Instance
  export default autocannon
}
