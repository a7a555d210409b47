import { describe, expect, it } from 'vitest';
import { loadPaymentsConfig } from './paymentsEnv';

describe('payment settings from the environment', () => {
  it('uses the local stand-in when nothing is set, outside production', () => {
    expect(loadPaymentsConfig({ NODE_ENV: 'development' })).toEqual({ mode: 'local', currency: 'usd', webhookSecret: undefined });
  });

  it('turns online payments off in production without keys, rather than take pretend payments', () => {
    expect(loadPaymentsConfig({ NODE_ENV: 'production' })).toEqual({ mode: 'off', currency: 'usd' });
  });

  it('reaches the provider itself with a real key and its webhook secret', () => {
    const config = loadPaymentsConfig({ STRIPE_SECRET_KEY: 'sk_test_51Abc', STRIPE_WEBHOOK_SECRET: 'whsec_abc123', PAYMENT_CURRENCY: 'cad' });
    expect(config).toEqual({ mode: 'remote', currency: 'cad', secretKey: 'sk_test_51Abc', webhookSecret: 'whsec_abc123', apiUrl: undefined });
  });

  it('points the SDK at STRIPE_API_URL when given', () => {
    const config = loadPaymentsConfig({ STRIPE_SECRET_KEY: 'sk_test_local', STRIPE_WEBHOOK_SECRET: 'whsec_x', STRIPE_API_URL: 'http://127.0.0.1:12111' });
    expect(config).toMatchObject({ mode: 'remote', apiUrl: 'http://127.0.0.1:12111' });
  });

  it('fails loudly with every problem named', () => {
    expect(() => loadPaymentsConfig({ STRIPE_SECRET_KEY: 'sk_live_abc' })).toThrow('STRIPE_WEBHOOK_SECRET must be set as well');
    expect(() => loadPaymentsConfig({ STRIPE_SECRET_KEY: 'pk_test_abc', STRIPE_WEBHOOK_SECRET: 'whsec_x' })).toThrow('STRIPE_SECRET_KEY must look like sk_test_... or sk_live_...');
    expect(() => loadPaymentsConfig({ STRIPE_API_URL: 'ftp://x' })).toThrow('STRIPE_API_URL must start with http:// or https://');
    expect(() => loadPaymentsConfig({ PAYMENT_CURRENCY: 'jpy' })).toThrow('PAYMENT_CURRENCY');
  });
});
