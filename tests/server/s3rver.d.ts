// The parts of s3rver (a local S3 fake, no types of its own) the tests use.
declare module 's3rver' {
  interface Options {
    address?: string
    port?: number
    silent?: boolean
    directory?: string
    configureBuckets?: { name: string; configs: unknown[] }[]
  }
  export default class S3rver {
    constructor(options: Options)
    run(): Promise<{ address: string; port: number }>
    close(): Promise<void>
  }
}
