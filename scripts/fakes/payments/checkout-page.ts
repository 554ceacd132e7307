// The fake's own hosted checkout page: plain HTML with one form, so that end-to-end tests
// type a test card number as a customer would.
import type { CheckoutSession } from './objects';

const escape = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

const money = (cents: number, currency: string) =>
  new Intl.NumberFormat('en-GB', { style: 'currency', currency: currency.toUpperCase() }).format(cents / 100);

export function checkoutPage(
  session: CheckoutSession,
  line: { quantity: number; unitAmount: number; nickname: string },
  message?: string,
): string {
  const total = money(session.amount_total, session.currency);
  const body =
    session.status === 'open'
      ? `<form method="post" action="/checkout/${escape(session.id)}/pay">
      <label for="card">Card number</label>
      <input id="card" name="card" inputmode="numeric" autocomplete="cc-number" placeholder="4242 4242 4242 4242" required autofocus>
      <div class="row">
        <div><label for="expiry">Expiry (MM / YY)</label><input id="expiry" name="expiry" placeholder="12 / 34" required></div>
        <div><label for="cvc">CVC</label><input id="cvc" name="cvc" inputmode="numeric" placeholder="123" required></div>
      </div>
      ${message ? `<p class="alert" role="alert">${escape(message)}</p>` : ''}
      <button type="submit">Pay ${escape(total)}</button>
    </form>
    ${session.cancel_url ? `<p><a href="${escape(session.cancel_url)}">Cancel and go back</a></p>` : ''}
    <p class="hint">Test cards: 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined.</p>`
      : `<p role="status">This checkout is complete.</p><p><a href="${escape(session.success_url)}">Return</a></p>`;
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Test payment</title>
<style>
  body { font: 15px/1.45 system-ui, sans-serif; background: #f4f4f6; color: #222; margin: 0; }
  main { max-width: 420px; margin: 48px auto; background: #fff; border: 1px solid #ddd; border-radius: 6px; padding: 24px 28px; }
  h1 { font-size: 18px; margin: 0 0 4px; } .sum { font-size: 26px; font-weight: 600; margin: 8px 0 18px; }
  label { display: block; font-size: 13px; color: #555; margin: 10px 0 4px; }
  input { width: 100%; box-sizing: border-box; padding: 8px 10px; font-size: 15px; border: 1px solid #bbb; border-radius: 4px; }
  .row { display: flex; gap: 12px; } .row > div { flex: 1; }
  button { margin-top: 16px; width: 100%; padding: 10px; font-size: 15px; font-weight: 600; color: #fff; background: #3a3a8c; border: 0; border-radius: 4px; cursor: pointer; }
  .alert { color: #a11; background: #fde8e8; border: 1px solid #f3b5b5; padding: 8px 10px; border-radius: 4px; }
  .hint { font-size: 12px; color: #777; } .badge { font-size: 11px; text-transform: uppercase; letter-spacing: .06em; color: #777; }
</style></head>
<body><main>
  <p class="badge">Local test payment page</p>
  <h1>${escape(line.nickname)}: ${line.quantity} × ${escape(money(line.unitAmount, session.currency))}</h1>
  <p class="sum" data-testid="checkout-total">${escape(total)} per month</p>
  ${body}
</main></body></html>`;
}
