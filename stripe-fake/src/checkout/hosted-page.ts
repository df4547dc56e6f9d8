import { formatMinorUnits } from '../currency.ts';
import type { SessionRecord } from '../objects.ts';

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (char) => `&#${char.charCodeAt(0)};`);
}

function page(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex">
<title>${escapeHtml(title)}</title>
<style>
  body { font-family: system-ui, sans-serif; margin: 0; background: #f4f5f7; color: #1c1f24; }
  main { max-width: 30rem; margin: 2rem auto; background: #fff; border-radius: 8px; padding: 1.5rem 2rem; box-shadow: 0 1px 3px #0002; }
  .banner { background: #fff3c4; border: 1px solid #e0c050; border-radius: 6px; padding: .5rem .75rem; font-size: .9rem; }
  h1 { font-size: 1.35rem; margin: 1rem 0 0; }
  .amount { font-size: 2rem; font-weight: 700; margin: .25rem 0 1rem; }
  table { width: 100%; border-collapse: collapse; margin-bottom: 1rem; }
  td { padding: .25rem 0; } td.sum { text-align: right; }
  label { display: block; font-weight: 600; margin-bottom: .25rem; }
  input { width: 100%; box-sizing: border-box; font-size: 1.1rem; padding: .5rem; border: 1px solid #888; border-radius: 4px; }
  button { margin-top: 1rem; width: 100%; font-size: 1.1rem; padding: .7rem; border: 0; border-radius: 4px; background: #1f4fd1; color: #fff; cursor: pointer; }
  .error { color: #a30d0d; font-weight: 600; }
  .hint { color: #555; font-size: .85rem; }
</style>
</head>
<body>
<main>
<p class="banner"><strong>Local test payment page.</strong> This is the development stand-in for the payment service; no real card is charged and no money moves.</p>
${body}
</main>
</body>
</html>
`;
}

function summary(record: SessionRecord): string {
  const { session, lineItems } = record;
  const rows = lineItems
    .map((item) => {
      const quantity = item.quantity > 1 ? ` × ${item.quantity}` : '';
      return `<tr><td>${escapeHtml(item.description)}${quantity}</td><td class="sum">${formatMinorUnits(item.amount_total, item.currency)}</td></tr>`;
    })
    .join('\n');
  return `<h1>Pay ${escapeHtml(lineItems.map((item) => item.description).join(', '))}</h1>
<p class="amount" data-testid="amount">${formatMinorUnits(session.amount_total, session.currency)}</p>
<table>${rows}</table>`;
}

/** The card form of an open session, with a message when the last attempt failed. */
export function checkoutPage(record: SessionRecord, errorMessage?: string): string {
  const { session } = record;
  const total = formatMinorUnits(session.amount_total, session.currency);
  const error = errorMessage ? `<p class="error" role="alert">${escapeHtml(errorMessage)}</p>` : '';
  const cancel = session.cancel_url ? `<p><a href="${escapeHtml(session.cancel_url)}">Cancel and go back</a></p>` : '';
  return page(
    `Pay ${total} — local test payment`,
    `${summary(record)}
${error}
<form method="post" action="/checkout/${escapeHtml(session.id)}/pay">
  <label for="card_number">Card number</label>
  <input id="card_number" name="card_number" inputmode="numeric" autocomplete="cc-number" placeholder="4242 4242 4242 4242" required>
  <p class="hint">Test cards: 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined.</p>
  <button type="submit">Pay ${total}</button>
</form>
${cancel}`,
  );
}

/** What a payer sees on a session that can no longer be paid. */
export function closedSessionPage(record: SessionRecord, successUrl: string | null): string {
  const { session } = record;
  if (session.status === 'complete') {
    const back = successUrl ? `<p><a href="${escapeHtml(successUrl)}">Continue</a></p>` : '';
    return page('Payment complete — local test payment', `${summary(record)}\n<p>This payment is complete.</p>\n${back}`);
  }
  const back = session.cancel_url ? `<p><a href="${escapeHtml(session.cancel_url)}">Go back</a></p>` : '';
  return page(
    'Payment expired — local test payment',
    `${summary(record)}\n<p class="error">This checkout session has expired; start the payment again from the site.</p>\n${back}`,
  );
}

/** Shown after paying a session that has no success URL to return to. */
export function paidPage(record: SessionRecord): string {
  return page('Payment received — local test payment', `${summary(record)}\n<p>Payment received. You can close this page.</p>`);
}

export function unknownSessionPage(sessionId: string): string {
  return page(
    'Unknown checkout session — local test payment',
    `<h1>Unknown checkout session</h1>
<p class="error">There is no checkout session ${escapeHtml(sessionId)} here. The stand-in keeps sessions in memory, so a session from before its last restart is gone; start the payment again from the site.</p>`,
  );
}
