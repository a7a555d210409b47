import nodemailer, { type Transporter } from 'nodemailer';
import type { Db } from '../../db/client';
import { mailMessages } from '../../db/schema';
import { HttpError } from '../errors';
import { startSmtpFake } from './smtpFake';

/** One message a shop sends; `text` and `html` carry the same words. */
export interface OutgoingMail {
  shopId: string;
  to: string;
  subject: string;
  text: string;
  /** Already escaped HTML; build it with escapeHtml around every user-supplied value. */
  html?: string;
  /** What the message is for, e.g. "invitation"; the outbox shows it. */
  purpose: string;
  /** Pictures carried inside the message and named from the HTML as `cid:<cid>`; never fetched from a URL. */
  inlineImages?: InlineImage[];
}

/** An image attached inline (RFC 2392 Content-ID), e.g. the proof's picture. */
export interface InlineImage {
  cid: string;
  filename: string;
  contentType: 'image/png' | 'image/jpeg';
  content: Buffer;
}

export interface SentMail {
  /** The outbox row. */
  id: string;
  messageId: string;
}

/** Sends a shop's mail and keeps a copy in its outbox; a failed send is kept too, then thrown as a 502. */
export interface Mailer {
  send(mail: OutgoingMail): Promise<SentMail>;
}

// Fail a request in seconds rather than the library's default of minutes when the mail server is away.
const timeouts = { connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 30_000 };

export function smtpTransport(url: string): Transporter {
  return nodemailer.createTransport({ url, ...timeouts });
}

/**
 * A mailer over any nodemailer transport. `transport` is a function so the
 * connection can be set up on first use (see `localMailer`).
 */
export function createMailer(db: Db, options: { transport: () => Promise<Transporter>; from: string }): Mailer {
  return {
    async send(mail) {
      const record = { shopId: mail.shopId, toAddress: mail.to, subject: mail.subject, textBody: mail.text, htmlBody: mail.html ?? null, purpose: mail.purpose };
      let messageId: string;
      try {
        const transport = await options.transport();
        const attachments = (mail.inlineImages ?? []).map((i) => ({ cid: i.cid, filename: i.filename, contentType: i.contentType, content: i.content, contentDisposition: 'inline' as const }));
        const info = await transport.sendMail({ from: options.from, to: mail.to, subject: mail.subject, text: mail.text, html: mail.html, attachments });
        messageId = String(info.messageId);
      } catch (err) {
        const reason = err instanceof Error ? err.message : String(err);
        await db.insert(mailMessages).values({ ...record, error: reason });
        throw new HttpError(502, 'mail_failed', `The e-mail to ${mail.to} could not be sent (${reason}). It is listed in the outbox; check the mail settings and try again.`);
      }
      const [row] = await db.insert(mailMessages).values({ ...record, messageId }).returning({ id: mailMessages.id });
      return { id: row!.id, messageId };
    },
  };
}

export const defaultFrom = 'Matwright <no-reply@matwright.example>';

/**
 * A mailer whose mail goes to an in-process SMTP fake, started on first send.
 * The fake does not keep the process alive, so tests and scripts can use it freely.
 */
export function localMailer(db: Db): Mailer {
  let transport: Promise<Transporter> | undefined;
  const start = () => (transport ??= startSmtpFake({ unref: true }).then((fake) => smtpTransport(fake.url)));
  return createMailer(db, { transport: start, from: defaultFrom });
}
