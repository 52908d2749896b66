// Request and response shapes of the string engine (POST /api/v1/engine/*), plain zod 4, one file per
// part. Engine functions take the *input* types (defaults optional) so the client can preview; the
// server parses first.
export * from './engine-assess'
export * from './engine-forecast'
export * from './engine-diagnostics'
export * from './engine-circuit'
