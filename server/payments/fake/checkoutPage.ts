import { escapeHtml } from '../../mail/escapeHtml';
import type { FakeLine, FakeSession } from './sessionStore';

const money = (cents: number, currency: string) =>
  new Intl.NumberFormat('en', { style: 'currency', currency: currency.toUpperCase() }).format(cents / 100);

// Plain HTML for a phone first: one column, large tap targets, no script at all.
const style = `
  *{box-sizing:border-box}
  body{margin:0;font:16px/1.45 system-ui,sans-serif;background:#f3f1ec;color:#1c1c1c}
  main{max-width:440px;margin:0 auto;padding:20px 16px 40px}
  .note{background:#fff6d6;border:1px solid #b58a00;border-radius:8px;padding:10px 12px;font-size:14px}
  .card{background:#fff;border:1px solid #d9d4c7;border-radius:12px;padding:16px;margin-top:16px}
  h1{font-size:22px;margin:0 0 4px}
  .total{font-size:30px;font-weight:700;margin:8px 0}
  ul{padding:0;margin:0;list-style:none}
  li{display:flex;justify-content:space-between;gap:12px;padding:6px 0;border-top:1px solid #eee}
  button{width:100%;min-height:52px;margin-top:18px;border:0;border-radius:10px;background:#1f3a5c;color:#fff;font-size:18px;font-weight:600}
  a{color:#1f3a5c}
  .back{display:block;text-align:center;margin-top:16px;padding:10px}
`;

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title><style>${style}</style></head><body><main>
<p class="note">Local test payment page: no card is charged and no money moves. A real provider key replaces this page.</p>
${body}</main></body></html>`;
}

/** The page the customer pays on: what for, how much, a Pay button and a way back. */
export function checkoutPage(session: FakeSession, lines: FakeLine[]): string {
  const items = lines
    .map((l) => `<li><span>${escapeHtml(l.name)}${l.quantity > 1 ? ` x ${l.quantity}` : ''}</span><span>${money(l.unitAmount * l.quantity, session.currency)}</span></li>`)
    .join('');
  const email = session.customer_email ? `<p>Receipt to ${escapeHtml(session.customer_email)}</p>` : '';
  const back = session.cancel_url ? `<a class="back" href="${escapeHtml(session.cancel_url)}">Cancel and go back</a>` : '';
  return page(
    'Pay',
    `<div class="card"><h1>Pay</h1><p class="total" data-testid="checkout-total">${money(session.amount_total, session.currency)}</p>
<ul>${items}</ul>${email}
<form method="post" action="/pay/${encodeURIComponent(session.id)}"><button type="submit" data-testid="checkout-pay">Pay ${money(session.amount_total, session.currency)}</button></form>
${back}</div>`,
  );
}

/** A session that can no longer be paid: already paid or expired. */
export function closedPage(session: FakeSession, successUrl: string): string {
  const words = session.status === 'complete' ? 'This payment is already made.' : 'This payment page has expired; ask the shop for a new one.';
  const back = session.status === 'complete' ? `<a class="back" href="${escapeHtml(successUrl)}">Continue</a>` : '';
  return page('Payment closed', `<div class="card"><h1>${words}</h1>${back}</div>`);
}

/** Shown when the shop's server did not take the payment's notice; the payment itself is made. */
export function deliveryFailedPage(session: FakeSession, successUrl: string, reason: string): string {
  return page(
    'Payment made',
    `<div class="card"><h1>Payment made</h1><p>The shop's server did not confirm it yet (${escapeHtml(reason)}).</p>
<form method="post" action="/pay/${encodeURIComponent(session.id)}/notify"><button type="submit" data-testid="checkout-notify">Tell the shop again</button></form>
<a class="back" href="${escapeHtml(successUrl)}">Continue</a></div>`,
  );
}

export function notFoundPage(): string {
  return page('Not found', '<div class="card"><h1>There is no payment at this address.</h1></div>');
}
