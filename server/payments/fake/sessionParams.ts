import { z } from 'zod';

/**
 * The Checkout Session parameters the local stand-in understands, as the provider's SDK sends
 * them (form-encoded, so every number arrives as text). Anything else is refused the way the
 * provider refuses it: 400 invalid_request_error naming the parameter.
 */
const metadata = z
  .record(z.string().max(40, 'Metadata keys can be at most 40 characters'), z.string().max(500, 'Metadata values can be at most 500 characters'))
  .refine((m) => Object.keys(m).length <= 50, 'Metadata can have at most 50 keys');

const integerText = (param: string, min: number) =>
  z
    .string({ error: `Missing required param: ${param}.` })
    .regex(/^\d+$/, `Invalid integer: ${param}`)
    .transform(Number)
    .refine((n) => n >= min, `This value must be greater than or equal to ${min}.`);

const lineItem = z
  .object({
    quantity: integerText('quantity', 1),
    price_data: z
      .object({
        currency: z.string({ error: 'Missing required param: currency.' }).regex(/^[a-z]{3}$/, 'Invalid currency'),
        unit_amount: integerText('unit_amount', 0),
        product_data: z.object({ name: z.string().min(1, 'Missing required param: name.'), description: z.string().max(500).optional() }).strict(),
      })
      .strict(),
  })
  .strict();

export const sessionCreateParams = z
  .object({
    mode: z.literal('payment', { error: 'This stand-in supports mode=payment only' }),
    success_url: z.string({ error: 'Missing required param: success_url.' }).url('Not a valid URL'),
    cancel_url: z.string().url('Not a valid URL').optional(),
    line_items: z.array(lineItem, { error: 'Missing required param: line_items.' }).min(1, 'Missing required param: line_items.').max(100),
    metadata: metadata.optional(),
    client_reference_id: z.string().max(200).optional(),
    customer_email: z.string().email('Invalid email address').optional(),
    payment_intent_data: z.object({ metadata: metadata.optional(), description: z.string().max(1000).optional() }).strict().optional(),
    expand: z.array(z.string()).optional(),
  })
  .strict();

export type SessionCreateParams = z.infer<typeof sessionCreateParams>;

/** The provider's error body for the first problem, with the parameter path in its bracket form. */
export function invalidRequest(error: z.ZodError): { type: 'invalid_request_error'; message: string; param?: string } {
  const issue = error.issues[0]!;
  if (issue.code === 'unrecognized_keys') {
    const prefix = issue.path.length ? `${bracketPath(issue.path)}[` : '';
    const name = `${prefix}${issue.keys[0]}${prefix ? ']' : ''}`;
    return { type: 'invalid_request_error', message: `Received unknown parameter: ${name}`, param: name };
  }
  return { type: 'invalid_request_error', message: issue.message, param: bracketPath(issue.path) };
}

function bracketPath(path: PropertyKey[]): string {
  const [first, ...rest] = path.map(String);
  return `${first ?? ''}${rest.map((p) => `[${p}]`).join('')}`;
}
