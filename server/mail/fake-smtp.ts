// A local SMTP server for development and tests: it accepts every message and stores it in
// caught_mail, where the in-app mail outbox page reads it. Never used when SMTP_URL is set.
import { SMTPServer } from 'smtp-server'
import { simpleParser } from 'mailparser'
import type { Db } from '../db'
import { logger } from '../logger'

export function startFakeSmtp(db: Db, port: number): Promise<{ port: number; close(): Promise<void> }> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: 5 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          const to = session.envelope.rcptTo.map((r) => r.address).join(', ')
          await db('caughtMail').insert({
            messageId: mail.messageId ?? null,
            fromAddress: mail.from?.text ?? null,
            toAddress: to,
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
            receivedAt: new Date(),
          })
          callback()
        })
        .catch((err: Error) => callback(err))
    },
  })
  // Port 0 (the default) takes a free port, so two instances run side by side.
  return new Promise((resolve, reject) => {
    server.once('error', reject)
    server.listen(port, '127.0.0.1', () => {
      server.off('error', reject)
      // A client's broken connection is reported here; without a listener it would end the process.
      server.on('error', (err) => logger.warn({ err }, 'local mail fake: connection error'))
      const addr = server.server.address()
      resolve({
        port: typeof addr === 'object' && addr ? addr.port : port,
        close: () => new Promise((r) => server.close(() => r())),
      })
    })
  })
}
