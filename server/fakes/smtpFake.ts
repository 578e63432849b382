// A local stand-in for the vendor-facing mail server: accepts every message on loopback and keeps
// it (in memory and as .eml files), so purchase orders can be "e-mailed" with no account anywhere.
// The app talks to it through nodemailer's ordinary SMTP transport, exactly as to a real server.
import { mkdirSync, writeFileSync } from 'node:fs'
import path from 'node:path'
import { SMTPServer } from 'smtp-server'

export interface CapturedMail {
  id: number
  from: string
  to: string[]
  raw: Buffer
  receivedAt: Date
}

export interface SmtpFake {
  port: number
  messages: CapturedMail[]
  close(): Promise<void>
}

export async function startSmtpFake(opts: { port: number; host?: string; saveDir?: string }): Promise<SmtpFake> {
  const messages: CapturedMail[] = []
  if (opts.saveDir) mkdirSync(opts.saveDir, { recursive: true })
  const server = new SMTPServer({
    secure: false,
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    banner: 'Lumenyard local mail catcher',
    logger: false,
    size: 25 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = []
      stream.on('data', (c: Buffer) => chunks.push(c))
      stream.on('end', () => {
        const mail: CapturedMail = {
          id: messages.length + 1,
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map((r) => r.address),
          raw: Buffer.concat(chunks),
          receivedAt: new Date(),
        }
        messages.push(mail)
        if (opts.saveDir) {
          writeFileSync(path.join(opts.saveDir, `${mail.receivedAt.toISOString().replace(/[:.]/g, '-')}-${mail.id}.eml`), mail.raw)
        }
        callback()
      })
    },
  })
  const host = opts.host ?? '127.0.0.1'
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject)
    server.listen(opts.port, host, () => resolve())
  })
  const address = server.server.address()
  const port = typeof address === 'object' && address ? address.port : opts.port
  return { port, messages, close: () => new Promise<void>((resolve) => server.close(() => resolve())) }
}
