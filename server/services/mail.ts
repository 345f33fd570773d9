import type { Transporter } from 'nodemailer'
import { config } from '../config.js'
import { HttpError } from '../errors.js'
import { mailSinkPort } from './mailSink.js'

export interface MailMessage {
  to: string
  subject: string
  text: string
  html?: string
}

let cached: { key: string; transport: Transporter } | null = null

async function transporter(): Promise<Transporter> {
  const cfg = config()
  const sinkPort = cfg.smtpUrl ? null : mailSinkPort()
  if (!cfg.smtpUrl && sinkPort === null) {
    throw new HttpError(503, 'UNAVAILABLE', 'E-mail is not available right now; try again later')
  }
  const key = cfg.smtpUrl ?? `sink:${sinkPort}`
  if (cached?.key !== key) {
    // Loaded on the first message: most server processes send none.
    const nodemailer = (await import('nodemailer')).default
    const transport = cfg.smtpUrl
      ? nodemailer.createTransport(cfg.smtpUrl)
      : nodemailer.createTransport({ host: '127.0.0.1', port: sinkPort!, secure: false, ignoreTLS: true })
    cached = { key, transport }
  }
  return cached.transport
}

/**
 * Sends one message over SMTP: SMTP_URL when set, else the local sink on loopback.
 * @throws HttpError 503 UNAVAILABLE when no mail server is reachable or it refuses the message
 */
export async function sendMail(msg: MailMessage): Promise<void> {
  try {
    await (await transporter()).sendMail({ from: config().mailFrom, ...msg })
  } catch (err) {
    if (err instanceof HttpError) throw err
    throw new HttpError(503, 'UNAVAILABLE', 'Could not send the e-mail; try again later')
  }
}

/** Whether mail goes to the local sink (dev and tests), which the dev outbox may show. */
export function usingLocalSink(): boolean {
  return !config().smtpUrl
}
