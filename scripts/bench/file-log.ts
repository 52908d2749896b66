// Imported first by benchmarks that measure the app's cost per request in their own process: the app
// logs every request as in production (LOG_LEVEL info), but to a file in the bench's data folder so
// that the lines do not bury the results. The logger reads both when its module is first evaluated.
process.env.LOG_LEVEL = process.env.BENCH_LOG_LEVEL ?? 'info'
process.env.LOG_FILE ??= `${process.env.BENCH_DATA_DIR ?? '.bench-data'}/requests.log`
