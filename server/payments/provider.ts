import { randomBytes } from 'node:crypto';
import type { Logger } from 'pino';
import Stripe from 'stripe';
import { startPaymentFake } from './fake/fakeProvider';
import type { PaymentsConfig } from './paymentsEnv';

/** The payment provider as the routes use it: the official SDK, the webhook secret and the shop's currency. */
export interface PaymentsProvider {
  stripe: Stripe;
  webhookSecret: string;
  currency: string;
}

// A request to the provider fails in seconds rather than the SDK's default of 80.
const REQUEST_TIMEOUT_MS = 20_000;

/** The SDK pointed at `apiUrl` (a stand-in) or, without one, at the provider itself. */
export function stripeClient(secretKey: string, apiUrl?: string): Stripe {
  if (!apiUrl) return new Stripe(secretKey, { timeout: REQUEST_TIMEOUT_MS, maxNetworkRetries: 2, telemetry: false });
  const url = new URL(apiUrl);
  const protocol = url.protocol === 'https:' ? 'https' : 'http';
  return new Stripe(secretKey, {
    host: url.hostname,
    port: Number(url.port || (protocol === 'https' ? 443 : 80)),
    protocol,
    timeout: REQUEST_TIMEOUT_MS,
    maxNetworkRetries: 0,
    telemetry: false,
  });
}

/** A key and a signing secret for the local stand-in, new for every process. */
export function localProviderSecrets(webhookSecret?: string) {
  return { secretKey: `sk_test_local${randomBytes(12).toString('hex')}`, webhookSecret: webhookSecret ?? `whsec_${randomBytes(24).toString('base64url')}` };
}

/**
 * The server's payment provider from its settings: the local stand-in (started here, sending its
 * webhooks to `webhookUrl`) or the configured service.
 */
export async function startPayments(config: Exclude<PaymentsConfig, { mode: 'off' }>, webhookUrl: string, logger: Logger): Promise<{ provider?: PaymentsProvider; close(): Promise<void> }> {
  if (config.mode === 'remote') {
    const where = config.apiUrl ? new URL(config.apiUrl).host : 'the payment provider';
    logger.info(`online payments go to ${where}${config.secretKey.includes('_live_') ? ' (live key)' : ''}`);
    return { provider: { stripe: stripeClient(config.secretKey, config.apiUrl), webhookSecret: config.webhookSecret, currency: config.currency }, close: async () => {} };
  }
  const secrets = localProviderSecrets(config.webhookSecret);
  const fake = await startPaymentFake({ ...secrets, webhookUrl });
  logger.info(`payments stay on this machine: a local stand-in of the payment provider listens at ${new URL(fake.url).host}`);
  return { provider: { stripe: stripeClient(secrets.secretKey, fake.url), webhookSecret: secrets.webhookSecret, currency: config.currency }, close: () => fake.close() };
}
