import { z } from 'zod';

const whole = (what: string) => z.coerce.number({ error: `${what} must be a whole number` }).int(`${what} must be a whole number`);

/** Query string of the outbox list; numbers arrive as text. */
export const outboxQuery = z.object({
  limit: whole('limit').min(1, 'limit must be at least 1').max(100, 'limit must be at most 100').default(25),
  offset: whole('offset').min(0, 'offset cannot be negative').default(0),
});
export type OutboxQuery = z.infer<typeof outboxQuery>;

export const outboxItem = z.object({
  id: z.string().uuid(),
  toAddress: z.string(),
  subject: z.string(),
  purpose: z.string(),
  sentAt: z.string(),
  /** Why sending failed; null when the mail server took the message. */
  error: z.string().nullable(),
});
export type OutboxItem = z.infer<typeof outboxItem>;

export const outboxPage = z.object({
  messages: z.array(outboxItem),
  total: z.number().int(),
  limit: z.number().int(),
  offset: z.number().int(),
});
export type OutboxPage = z.infer<typeof outboxPage>;

export const outboxMessage = outboxItem.extend({
  textBody: z.string(),
  htmlBody: z.string().nullable(),
  messageId: z.string().nullable(),
  /** True when the bodies are withheld from this reader (an invitation link, shown to owners only). */
  withheld: z.boolean(),
});
export type OutboxMessage = z.infer<typeof outboxMessage>;
