import { pino } from 'pino'

// LOG_FILE: the log lines go to that file (appended, made with its folder) instead of stdout; every
// API process of npm start may share it (each line is one append).
const file = process.env.LOG_FILE

export const logger = pino(
  {
    level: process.env.LOG_LEVEL ?? (process.env.NODE_ENV === 'test' ? 'silent' : 'info'),
    redact: ['req.headers.authorization', 'req.headers.cookie', 'res.headers["set-cookie"]'],
  },
  file ? pino.destination({ dest: file, mkdir: true }) : undefined,
)
