import { formatAmount } from './money';
import type { CheckoutLineItem, CheckoutSession, Account } from './types';

// Plain server-rendered pages standing in for the hosted checkout and onboarding, which cannot be used
// offline. They have their own look, say plainly that they are a local test fake, and work without script.

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (ch) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[ch] as string);
}

const STYLE = `
  :root { color-scheme: light; font-family: system-ui, sans-serif; line-height: 1.5; }
  body { margin: 0; background: #f3f1ec; color: #1d1b18; }
  main { max-width: 34rem; margin: 2rem auto; padding: 1.5rem; background: #fff; border: 1px solid #cfc8bb; border-radius: 8px; }
  .banner { margin: 0 0 1rem; padding: .5rem .75rem; background: #fff4c2; border: 1px solid #8a6d00; border-radius: 4px; font-weight: 600; }
  h1 { font-size: 1.5rem; margin: .5rem 0 1rem; }
  table { width: 100%; border-collapse: collapse; margin-bottom: 1.25rem; }
  caption { text-align: left; font-weight: 600; padding-bottom: .25rem; }
  th, td { text-align: left; padding: .35rem .25rem; border-bottom: 1px solid #e4dfd5; }
  td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; }
  label { display: block; font-weight: 600; margin-bottom: .25rem; }
  input { font: inherit; width: 100%; box-sizing: border-box; padding: .5rem; border: 2px solid #5b554b; border-radius: 4px; }
  input:focus-visible, button:focus-visible, a:focus-visible { outline: 3px solid #1a55b0; outline-offset: 2px; }
  .hint { color: #4a453d; font-size: .9rem; }
  button { font: inherit; margin-top: 1rem; padding: .6rem 1.2rem; background: #1d4f3a; color: #fff; border: 0; border-radius: 4px; cursor: pointer; }
  .error { margin: 0 0 1rem; padding: .6rem .75rem; border: 2px solid #a3211b; background: #fdecea; color: #5c0f0b; border-radius: 4px; }
  .done { margin: 0 0 1rem; padding: .6rem .75rem; border: 2px solid #1d4f3a; background: #e8f4ee; border-radius: 4px; }
`;

function page(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>${STYLE}</style>
</head>
<body>
<main>
<p class="banner" role="note">Test payment page — local fake, no real money</p>
${body}
</main>
</body>
</html>`;
}

function lineItemRows(items: CheckoutLineItem[]): string {
  return items
    .map(
      (item) => `<tr><td>${escapeHtml(item.description)}</td><td class="num">${item.quantity}</td><td class="num">${escapeHtml(
        formatAmount(item.price.unit_amount, item.currency),
      )}</td><td class="num">${escapeHtml(formatAmount(item.amount_total, item.currency))}</td></tr>`,
    )
    .join('\n');
}

function summaryTable(session: CheckoutSession, items: CheckoutLineItem[]): string {
  return `<table>
<caption>Order summary</caption>
<thead><tr><th scope="col">Item</th><th scope="col" class="num">Qty</th><th scope="col" class="num">Unit price</th><th scope="col" class="num">Amount</th></tr></thead>
<tbody>
${lineItemRows(items)}
</tbody>
<tfoot><tr><th scope="row" colspan="3">Total</th><td class="num"><strong>${escapeHtml(formatAmount(session.amount_total, session.currency))}</strong></td></tr></tfoot>
</table>`;
}

export interface PageError {
  code: string;
  decline_code?: string;
  message: string;
}

function errorBox(error: PageError): string {
  const detail = error.decline_code ? `${error.code}: ${error.decline_code}` : error.code;
  return `<div class="error" role="alert" id="card-error"><strong>Payment not completed.</strong> ${escapeHtml(error.message)} <span class="hint">(${escapeHtml(detail)})</span></div>`;
}

/** The payable page; after a decline it shows the reason and keeps the form. */
export function checkoutPage(session: CheckoutSession, items: CheckoutLineItem[], error: PageError | null, typedCard = ''): string {
  const total = formatAmount(session.amount_total, session.currency);
  const describedBy = error ? 'card-help card-error' : 'card-help';
  const cancel = session.cancel_url ? `<p><a href="${escapeHtml(session.cancel_url)}">Cancel and go back</a></p>` : '';
  return page(
    `Pay ${total} — test payment page`,
    `<h1>Pay ${escapeHtml(total)}</h1>
${summaryTable(session, items)}
${error ? errorBox(error) : ''}
<form method="post">
<label for="card">Card number</label>
<input id="card" name="card" type="text" inputmode="numeric" autocomplete="cc-number" required aria-describedby="${describedBy}"${
      error ? ' aria-invalid="true"' : ''
    } value="${escapeHtml(typedCard)}">
<p class="hint" id="card-help">Test cards only: 4242 4242 4242 4242 succeeds; 4000 0000 0000 0002 is declined; 4000 0000 0000 9995 has insufficient funds.</p>
<button type="submit">Pay ${escapeHtml(total)}</button>
</form>
${cancel}`,
  );
}

export function checkoutClosedPage(session: CheckoutSession, items: CheckoutLineItem[], successUrl: string | null): string {
  const total = formatAmount(session.amount_total, session.currency);
  if (session.status === 'complete') {
    const next = successUrl ? `<p><a href="${escapeHtml(successUrl)}">Continue</a></p>` : '';
    return page(`Paid ${total} — test payment page`, `<h1>Payment complete</h1>
<p class="done" role="status">${escapeHtml(total)} was paid with a test card.</p>
${summaryTable(session, items)}
${next}`);
  }
  const back = session.cancel_url ? `<p><a href="${escapeHtml(session.cancel_url)}">Go back</a></p>` : '';
  return page(`Expired — test payment page`, `<h1>This checkout has expired</h1>
<p class="error" role="alert">This checkout session has expired and can no longer be paid. Start the payment again from the site.</p>
${summaryTable(session, items)}
${back}`);
}

export function messagePage(title: string, message: string): string {
  return page(title, `<h1>${escapeHtml(title)}</h1>\n<p>${escapeHtml(message)}</p>`);
}

export function onboardingPage(account: Account): string {
  return page(
    'Connect a payout account — test onboarding',
    `<h1>Connect a payout account</h1>
<p>This stands in for the payment processor's hosted onboarding. Nothing is verified and no bank details are asked for.</p>
<dl>
<dt>Account</dt><dd><code>${escapeHtml(account.id)}</code></dd>
<dt>Email</dt><dd>${escapeHtml(account.email ?? 'not given')}</dd>
<dt>Country</dt><dd>${escapeHtml(account.country)}</dd>
</dl>
<form method="post">
<button type="submit">Finish onboarding (test)</button>
</form>`,
  );
}
