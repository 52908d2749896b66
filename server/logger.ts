import { pino } from 'pino'

// LOG_FILE: the log lines go to that file (appended, made with its folder) instead of stdout; every
// API process of npm start may share it (each line is one append). Written asynchronously (pino's
// advice for servers): a request does not wait for its log line to reach the disk or the pipe; the
// lines still waiting are flushed when the process exits.
const file = process.env.LOG_FILE

export const logger = pino(
  {
    level: process.env.LOG_LEVEL ?? (process.env.NODE_ENV === 'test' ? 'silent' : 'info'),
    redact: ['req.headers.authorization', 'req.headers.cookie', 'res.headers["set-cookie"]'],
  },
  pino.destination({ dest: file ?? 1, sync: false, mkdir: !!file }),
)
