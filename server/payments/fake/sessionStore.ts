import { randomBytes } from 'node:crypto';
import type { SessionCreateParams } from './sessionParams';

/** A Checkout Session as the provider's API returns it (the fields the SDK's types name, in the same shape). */
export interface FakeSession {
  id: string;
  object: 'checkout.session';
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  created: number;
  currency: string;
  customer: null;
  customer_details: { email: string | null; name: string | null } | null;
  customer_email: string | null;
  expires_at: number;
  livemode: false;
  metadata: Record<string, string>;
  mode: 'payment';
  payment_intent: string | null;
  payment_method_types: string[];
  payment_status: 'unpaid' | 'paid';
  status: 'open' | 'complete' | 'expired';
  success_url: string;
  total_details: { amount_discount: number; amount_shipping: number; amount_tax: number };
  ui_mode: 'hosted';
  url: string | null;
}

/** One line as the stand-in's page shows it. */
export interface FakeLine {
  name: string;
  quantity: number;
  unitAmount: number;
}

/** A webhook event as the provider sends it. */
export interface FakeEvent {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: FakeSession };
  livemode: false;
  pending_webhooks: number;
  request: { id: null; idempotency_key: null };
  type: string;
}

// Sessions stay open a day, like the provider's default.
const SESSION_LIFETIME_S = 24 * 60 * 60;
/** Sessions kept in memory at most; the oldest go first so a long-running server does not grow without end. */
export const KEEP_SESSIONS = 1000;

export const providerId = (prefix: string) => `${prefix}_${randomBytes(18).toString('base64url').replace(/[-_]/g, 'x')}`;
const nowS = () => Math.floor(Date.now() / 1000);

export interface SessionStore {
  create(params: SessionCreateParams, payPageBase: string): FakeSession;
  get(id: string): FakeSession | undefined;
  lines(id: string): FakeLine[];
  /** Marks an open session paid; returns false when it was not open. */
  complete(id: string): boolean;
}

export function createSessionStore(): SessionStore {
  const sessions = new Map<string, { session: FakeSession; lines: FakeLine[] }>();
  return {
    create(params, payPageBase) {
      const lines = params.line_items.map((l) => ({ name: l.price_data.product_data.name, quantity: l.quantity, unitAmount: l.price_data.unit_amount }));
      const total = lines.reduce((sum, l) => sum + l.quantity * l.unitAmount, 0);
      const id = `cs_test_${providerId('a').slice(2)}`;
      const created = nowS();
      const session: FakeSession = {
        id,
        object: 'checkout.session',
        amount_subtotal: total,
        amount_total: total,
        cancel_url: params.cancel_url ?? null,
        client_reference_id: params.client_reference_id ?? null,
        created,
        currency: params.line_items[0]!.price_data.currency,
        customer: null,
        customer_details: null,
        customer_email: params.customer_email ?? null,
        expires_at: created + SESSION_LIFETIME_S,
        livemode: false,
        metadata: params.metadata ?? {},
        mode: 'payment',
        payment_intent: null,
        payment_method_types: ['card'],
        payment_status: 'unpaid',
        status: 'open',
        success_url: params.success_url,
        total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
        ui_mode: 'hosted',
        url: `${payPageBase}/pay/${id}`,
      };
      sessions.set(id, { session, lines });
      if (sessions.size > KEEP_SESSIONS) sessions.delete(sessions.keys().next().value!);
      return session;
    },
    get(id) {
      const entry = sessions.get(id);
      if (entry && entry.session.status === 'open' && entry.session.expires_at <= nowS()) {
        entry.session = { ...entry.session, status: 'expired', url: null };
      }
      return entry?.session;
    },
    lines: (id) => sessions.get(id)?.lines ?? [],
    complete(id) {
      const entry = sessions.get(id);
      if (!entry || entry.session.status !== 'open') return false;
      const s = entry.session;
      entry.session = { ...s, status: 'complete', payment_status: 'paid', payment_intent: providerId('pi'), url: null, customer_details: { email: s.customer_email, name: null } };
      return true;
    },
  };
}

export function eventFor(session: FakeSession, type: string, apiVersion: string): FakeEvent {
  return {
    id: providerId('evt'),
    object: 'event',
    api_version: apiVersion,
    created: nowS(),
    data: { object: session },
    livemode: false,
    pending_webhooks: 1,
    request: { id: null, idempotency_key: null },
    type,
  };
}
