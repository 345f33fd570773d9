import type { AddressInfo } from 'node:net'
import { SMTPServer } from 'smtp-server'
import type { simpleParser as SimpleParser } from 'mailparser'
import { config } from '../config.js'
import { logger } from '../logger.js'
import { OutgoingMail } from '../models/OutgoingMail.js'

let server: SMTPServer | null = null
let port: number | null = null

async function store(raw: NodeJS.ReadableStream, rcptTo: string[]): Promise<void> {
  // Loaded on the first message: the parser is a large module most server processes never need.
  const { simpleParser } = await import('mailparser')
  const parsed = await simpleParser(raw as unknown as Parameters<typeof SimpleParser>[0])
  await OutgoingMail.create({
    to: rcptTo.join(', '),
    subject: parsed.subject ?? '',
    text: parsed.text ?? '',
    html: typeof parsed.html === 'string' ? parsed.html : null,
    via: 'local-sink',
  })
}

/**
 * Starts the loopback SMTP sink that stands in for a mail server when SMTP_URL is unset: it really
 * receives each message over SMTP, parses it and stores it in outgoing_mail before answering 250.
 * @returns the port it listens on (MAIL_SINK_PORT, or a free one when that is 0)
 */
export async function startMailSink(): Promise<number> {
  if (server && port !== null) return port
  const s = new SMTPServer({
    // The bundled self-signed certificate has expired; plain SMTP on loopback only (VERSIONS.md trap 9).
    disabledCommands: ['STARTTLS'],
    authOptional: true,
    logger: false,
    size: 5 * 1024 * 1024,
    onData(stream, session, callback) {
      const rcpt = session.envelope.rcptTo.map((a) => a.address)
      store(stream, rcpt).then(
        () => callback(),
        (err: Error) => {
          logger.error({ err: err.message }, 'mail sink: could not store a message')
          callback(err)
        },
      )
    },
  })
  s.on('error', (err) => logger.warn({ err: err.message }, 'mail sink error'))
  await new Promise<void>((resolve, reject) => {
    s.server.once('error', reject)
    s.listen(config().mailSinkPort, '127.0.0.1', () => resolve())
  })
  server = s
  port = (s.server.address() as AddressInfo).port
  logger.info(`local mail sink on smtp://127.0.0.1:${port}`)
  return port
}

/** Stops the sink; safe to call when it is not running. */
export async function stopMailSink(): Promise<void> {
  const s = server
  server = null
  port = null
  if (s) await new Promise<void>((resolve) => s.close(() => resolve()))
}

/** The sink's port while it runs, else null. */
export function mailSinkPort(): number | null {
  return port
}
