import type { Logger } from 'pino';
import type { Db } from '../../db/client';
import { createMailer, smtpTransport, type Mailer } from './mailer';
import type { MailEnv } from './mailEnv';
import { startSmtpFake } from './smtpFake';

/** The server's mailer: the real SMTP server when SMTP_URL is set, otherwise a local fake started here. */
export async function startMail(db: Db, env: MailEnv, logger: Logger): Promise<{ mailer: Mailer; close(): Promise<void> }> {
  if (env.SMTP_URL) {
    const transport = smtpTransport(env.SMTP_URL);
    logger.info({ host: new URL(env.SMTP_URL).host }, 'sending mail through the configured SMTP server');
    return { mailer: createMailer(db, { transport: async () => transport, from: env.MAIL_FROM }), close: async () => transport.close() };
  }
  const fake = await startSmtpFake();
  const transport = smtpTransport(fake.url);
  logger.info(`mail stays on this machine: a local SMTP fake listens at ${new URL(fake.url).host}; read sent mail in the Outbox screen`);
  return {
    mailer: createMailer(db, { transport: async () => transport, from: env.MAIL_FROM }),
    close: async () => {
      transport.close();
      await fake.close();
    },
  };
}
