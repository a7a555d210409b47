import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { pino } from 'pino';
import { inject } from 'vitest';
import { connectDatabase } from '../../db/client';
import { createApp } from '../app';
import { createMailer, smtpTransport } from '../mail/mailer';
import { startSmtpFake } from '../mail/smtpFake';
import { startPaymentFake, type PaymentFake } from '../payments/fake/fakeProvider';
import { localProviderSecrets, stripeClient, type PaymentsProvider } from '../payments/provider';
import { TEST_PUBLIC_URL, testThrottle, type MailHarness } from './harness';

export interface PaymentsHarness extends MailHarness {
  fake: PaymentFake;
  provider: PaymentsProvider;
  /** Where the app listens, so the stand-in's webhooks reach it over HTTP like the provider's. */
  appUrl: string;
}

/**
 * A test app whose payments go through the provider's real SDK to the local stand-in, whose
 * webhooks come back over HTTP to the app listening on a free port, and whose mail goes to an
 * SMTP fake the test can read.
 */
export async function createPaymentsHarness(): Promise<PaymentsHarness> {
  const smtp = await startSmtpFake();
  const database = connectDatabase(inject('databaseUrl'));
  const transport = smtpTransport(smtp.url);
  const mailer = createMailer(database.db, { transport: async () => transport, from: 'Matwright Tests <tests@matwright.example>' });
  const secrets = localProviderSecrets();
  const fake = await startPaymentFake(secrets);
  const provider = { stripe: stripeClient(secrets.secretKey, fake.url), webhookSecret: secrets.webhookSecret, currency: 'usd' };
  const app = createApp({ db: database.db, logger: pino({ level: 'silent' }), mailer, publicUrl: TEST_PUBLIC_URL, throttle: testThrottle, payments: provider });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const appUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  fake.setWebhookUrl(`${appUrl}/api/payments/webhook`);
  const close = async () => {
    transport.close();
    await Promise.all([smtp.close(), fake.close(), new Promise((resolve) => server.close(resolve)), database.close()]);
  };
  return { app, database, smtp, close, fake, provider, appUrl };
}
