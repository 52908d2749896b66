// Imported first by benchmarks that run the app in their own process: the logger reads LOG_LEVEL
// when its module is first evaluated, so this must come before any server import.
process.env.LOG_LEVEL = process.env.BENCH_LOG_LEVEL ?? 'silent'
