import { formatMoney, isCurrencyCode } from '#shared/domain/sales/money';

const escape = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

export function amountText(minor: number, currency: string): string {
  const code = currency.toUpperCase();
  return isCurrencyCode(code) ? formatMoney(minor, code, 'en-CA') : `${minor} ${code}`;
}

/**
 * The fake's own checkout page: plain HTML, one column, 48 px targets, readable at 360 px.
 * `problem` is shown in an alert (a declined card, a number that is not a test card).
 */
export function checkoutPage(session: {
  id: string;
  amount_total: number;
  currency: string;
  status: string;
  description: string;
  problem?: string;
  card?: string;
}): string {
  const amount = escape(amountText(session.amount_total, session.currency));
  const open = session.status === 'open';
  const body = open
    ? `<form method="post" action="/pay/${escape(session.id)}">
  <label for="card">Card number (test cards only)</label>
  <input id="card" name="card" inputmode="numeric" autocomplete="off" value="${escape(session.card ?? '')}"
    aria-describedby="card-help${session.problem ? ' problem' : ''}" required>
  <p id="card-help" class="help">This is Rackside's local test checkout: no real card is charged.
  4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined.</p>
  <button type="submit" name="action" value="pay" class="pay">Pay ${amount}</button>
  <button type="submit" name="action" value="cancel" class="cancel" formnovalidate>Cancel and go back</button>
</form>`
    : `<p role="status">This checkout is ${session.status === 'complete' ? 'paid' : 'closed'}. You can close this page.</p>`;
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>Test checkout – ${amount}</title>
<style>
  body { font: 18px/1.5 system-ui, sans-serif; margin: 0; padding: 16px; color: #111; background: #fff; }
  main { max-width: 28rem; margin: 0 auto; }
  h1 { font-size: 1.5rem; margin: 0 0 8px; }
  .amount { font-size: 2rem; font-weight: 700; margin: 0 0 16px; }
  label { display: block; font-weight: 600; margin-bottom: 4px; }
  input { box-sizing: border-box; width: 100%; min-height: 48px; font-size: 1.25rem; padding: 8px 12px;
    border: 2px solid #333; border-radius: 8px; }
  input:focus, button:focus { outline: 3px solid #1d4ed8; outline-offset: 2px; }
  .help { color: #333; font-size: 1rem; }
  button { display: block; width: 100%; min-height: 48px; margin-top: 12px; font-size: 1.125rem;
    border-radius: 8px; font-weight: 600; cursor: pointer; }
  .pay { background: #14532d; color: #fff; border: 2px solid #14532d; }
  .cancel { background: #fff; color: #111; border: 2px solid #333; }
  .problem { background: #fef2f2; color: #7f1d1d; border: 2px solid #7f1d1d; border-radius: 8px; padding: 8px 12px; }
</style>
</head>
<body>
<main>
  <h1>Test checkout</h1>
  <p>${escape(session.description)}</p>
  <p class="amount">${amount}</p>
  ${session.problem ? `<p id="problem" class="problem" role="alert">${escape(session.problem)}</p>` : ''}
  ${body}
</main>
</body>
</html>`;
}
