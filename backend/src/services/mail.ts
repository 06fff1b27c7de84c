import nodemailer, { type Transporter } from 'nodemailer';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import type { Logger } from 'pino';
import { MailMessageModel } from '../db/models';

export interface Mailer {
  send(message: { to: string | string[]; subject: string; text: string }): Promise<void>;
  close(): Promise<void>;
  /** True when mail goes to the local fake server that keeps every message. */
  readonly local: boolean;
}

interface MailOptions {
  smtpUrl?: string | undefined;
  fakePort: number;
  from: string;
  logger: Logger;
}

/**
 * Starts the local fake SMTP server (127.0.0.1 only) that stores every message it receives in
 * `mail_messages`, so admins can read them on the Local mailbox page.
 */
async function startFakeSmtp(port: number, logger: Logger): Promise<{ server: SMTPServer; port: number }> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    banner: 'Veracast local mailbox',
    size: 5 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const to = session.envelope.rcptTo.map((r) => r.address).join(', ');
          await MailMessageModel.create({
            fromAddress: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            toAddress: to,
            subject: parsed.subject ?? '(no subject)',
            textBody: parsed.text ?? '',
          });
          callback();
        })
        .catch((err: Error) => {
          logger.error({ err }, 'local mailbox could not store a message');
          callback(err);
        });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  server.on('error', (err) => logger.error({ err }, 'local SMTP server error'));
  const address = server.server.address();
  const actual = typeof address === 'object' && address ? address.port : port;
  return { server, port: actual };
}

/** Mail through nodemailer: real SMTP when `smtpUrl` is set, else the local fake server. */
export async function createMailer(options: MailOptions): Promise<Mailer> {
  let transport: Transporter;
  let fake: SMTPServer | undefined;
  if (options.smtpUrl) {
    transport = nodemailer.createTransport(options.smtpUrl);
  } else {
    const started = await startFakeSmtp(options.fakePort, options.logger);
    fake = started.server;
    options.logger.info(`local mailbox listening on 127.0.0.1:${started.port}`);
    transport = nodemailer.createTransport({ host: '127.0.0.1', port: started.port, secure: false, ignoreTLS: true });
  }
  return {
    local: fake !== undefined,
    async send({ to, subject, text }) {
      await transport.sendMail({ from: options.from, to, subject, text });
    },
    async close() {
      transport.close();
      if (fake) await new Promise<void>((resolve) => fake!.close(() => resolve()));
    },
  };
}
