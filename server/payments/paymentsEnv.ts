import { z } from 'zod';
import { paymentCurrencies } from '../../features/payments/schema';

const paymentsEnvSchema = z.object({
  /** The provider's secret key; sk_live_ or sk_test_ without STRIPE_API_URL reaches the real service. */
  STRIPE_SECRET_KEY: z
    .string()
    .regex(/^(sk|rk)_(live|test)_[A-Za-z0-9_]+$/, 'STRIPE_SECRET_KEY must look like sk_test_... or sk_live_...')
    .optional(),
  /** The signing secret of the webhook endpoint (whsec_...); required with a real key. */
  STRIPE_WEBHOOK_SECRET: z.string().regex(/^whsec_[A-Za-z0-9+/=_-]+$/, 'STRIPE_WEBHOOK_SECRET must look like whsec_...').optional(),
  /** Another API address (a stand-in run elsewhere), e.g. http://127.0.0.1:12111. */
  STRIPE_API_URL: z
    .string()
    .url('STRIPE_API_URL must be a URL like http://127.0.0.1:12111')
    .refine((v) => /^https?:$/.test(new URL(v).protocol), 'STRIPE_API_URL must start with http:// or https://')
    .optional(),
  /** The shop's currency for online payments; two-decimal currencies only. */
  PAYMENT_CURRENCY: z.enum(paymentCurrencies).default('usd'),
});

/**
 * Where online payments go:
 * - `local`: a stand-in started in this process (the default outside production);
 * - `remote`: the SDK at STRIPE_API_URL or at the provider itself, with the given key and secret;
 * - `off`: production without keys; manual payments still work, online ones answer 503.
 */
export type PaymentsConfig =
  | { mode: 'local'; currency: string; webhookSecret?: string }
  | { mode: 'remote'; currency: string; secretKey: string; webhookSecret: string; apiUrl?: string }
  | { mode: 'off'; currency: string };

/** Reads the payment settings once at start-up; fails loudly with every problem named. */
export function loadPaymentsConfig(source: NodeJS.ProcessEnv = process.env): PaymentsConfig {
  const parsed = paymentsEnvSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`The payment settings are not valid:\n${lines.join('\n')}`);
  }
  const env = parsed.data;
  const currency = env.PAYMENT_CURRENCY;
  if (env.STRIPE_SECRET_KEY || env.STRIPE_API_URL) {
    const missing = [!env.STRIPE_SECRET_KEY && 'STRIPE_SECRET_KEY', !env.STRIPE_WEBHOOK_SECRET && 'STRIPE_WEBHOOK_SECRET'].filter(Boolean);
    if (missing.length > 0) throw new Error(`The payment settings are not valid:\n  ${missing.join(' and ')} must be set as well`);
    return { mode: 'remote', currency, secretKey: env.STRIPE_SECRET_KEY!, webhookSecret: env.STRIPE_WEBHOOK_SECRET!, apiUrl: env.STRIPE_API_URL };
  }
  // A production server never takes pretend payments.
  if (source.NODE_ENV === 'production') return { mode: 'off', currency };
  return { mode: 'local', currency, webhookSecret: env.STRIPE_WEBHOOK_SECRET };
}

/** Online payments off: said once in the log; manual payments still work. */
export function paymentsOff(logger: { warn(message: string): void }) {
  logger.warn('online payments are off: set STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET to take cards online; manual payments still work');
  return { provider: undefined, close: async () => {} };
}
