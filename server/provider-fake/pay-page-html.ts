import type { CheckoutSessionObject, LineItemObject } from './resources';

/*
 * The fake's own hosted pay page: plain server-rendered HTML, no script, one stylesheet. Every
 * message is in words (never colour alone); fields have labels, hints and errors tied by
 * aria-describedby; the first heading says it is a local test page.
 */

export const PAY_PAGE_STYLESHEET = '/pay/assets/pay-page.css';

export interface CardFormState {
  readonly cardNumber?: string;
  readonly expiry?: string;
  readonly errors?: Partial<Record<CardField, string>>;
  /** A payment that did not go through (decline, failed authentication), said at the top. */
  readonly failure?: string;
}

export type CardField = 'card_number' | 'card_expiry' | 'card_cvc';

export interface PageOptions {
  /** Whose checkout this is, in the heading ("Pay Flowlore"). */
  readonly businessName: string;
}

export function payPage(session: CheckoutSessionObject, lineItems: readonly LineItemObject[], state: CardFormState, options: PageOptions): string {
  const total = money(session.amount_total, session.currency);
  const errors = state.errors ?? {};
  const errorCount = Object.keys(errors).length;
  const body = `
    <h1>Pay ${escape(options.businessName)}</h1>
    ${session.customer_email ? `<p>Receipt to <strong>${escape(session.customer_email)}</strong> (no e-mail is sent by this test page).</p>` : ''}
    ${state.failure ? `<div class="notice notice-problem" role="alert"><h2>Payment not made</h2><p>${escape(state.failure)}</p><p>Nothing was charged. You can try another card.</p></div>` : ''}
    ${errorCount ? `<div class="notice notice-problem" role="alert"><h2>Check the card details</h2><p>${errorCount === 1 ? 'One field needs' : `${errorCount} fields need`} a change: see the messages beside the fields.</p></div>` : ''}
    ${orderTable(lineItems, total)}
    <section aria-labelledby="card-heading">
      <h2 id="card-heading">Card details</h2>
      ${testCardList()}
      <form method="post" action="/pay/${escape(session.id)}" novalidate>
        ${field('card_number', 'Card number', 'Digits only; spaces are fine.', 'cc-number', state.cardNumber, errors.card_number)}
        ${field('card_expiry', 'Expiry date (MM / YY)', 'For example 12 / 34.', 'cc-exp', state.expiry, errors.card_expiry)}
        ${field('card_cvc', 'Security code (CVC)', '3 or 4 digits. Any number works here.', 'cc-csc', undefined, errors.card_cvc)}
        <div class="actions">
          <button type="submit">Pay ${escape(total)}</button>
          <a href="/pay/${escape(session.id)}/cancel">Cancel and go back</a>
        </div>
      </form>
    </section>`;
  return document(`Pay ${options.businessName} — local test payment page`, body);
}

export function authenticationPage(session: CheckoutSessionObject, attemptId: string, last4: string): string {
  const body = `
    <h1>Authentication step (test)</h1>
    <p>A bank may ask the card holder to confirm a payment. Here you play the bank: approve the payment of
      <strong>${escape(money(session.amount_total, session.currency))}</strong> with the card ending <strong>${escape(last4)}</strong>, or make the step fail.</p>
    <form method="post" action="/pay/${escape(session.id)}/authenticate">
      <input type="hidden" name="attempt" value="${escape(attemptId)}">
      <div class="actions">
        <button type="submit" name="decision" value="approve">Approve the payment</button>
        <button type="submit" name="decision" value="fail" class="secondary">Fail the authentication</button>
      </div>
    </form>`;
  return document('Authentication step (test) — local test payment page', body);
}

/** A session that can no longer be paid: complete or expired. */
export function closedPage(session: CheckoutSessionObject): string {
  const complete = session.status === 'complete';
  const back = complete ? session.success_url.replaceAll('{CHECKOUT_SESSION_ID}', session.id) : session.cancel_url;
  const body = `
    <h1>${complete ? 'This payment is complete' : 'This checkout has expired'}</h1>
    <p>${complete ? 'It was paid already. Nothing more to do here.' : 'It can no longer be paid. Start again from the site to get a new one.'}</p>
    ${back ? `<p><a href="${escape(back)}">Return to the site</a></p>` : ''}`;
  return document(`${complete ? 'Payment complete' : 'Checkout expired'} — local test payment page`, body);
}

export function notFoundPage(): string {
  return document('No such checkout — local test payment page', '<h1>No such checkout</h1><p>This link does not lead to a checkout this test server knows. It may have restarted.</p>');
}

function orderTable(lineItems: readonly LineItemObject[], total: string): string {
  const rows = lineItems
    .map(
      (item) =>
        `<tr><th scope="row">${escape(item.description)}</th><td>${item.quantity}</td><td>${escape(money(item.price.unit_amount, item.currency))}</td><td>${escape(money(item.amount_total, item.currency))}</td></tr>`,
    )
    .join('');
  return `
    <section aria-labelledby="order-heading">
      <h2 id="order-heading">Your order</h2>
      <table>
        <thead><tr><th scope="col">Item</th><th scope="col">Quantity</th><th scope="col">Unit price</th><th scope="col">Amount</th></tr></thead>
        <tbody>${rows}</tbody>
        <tfoot><tr><th scope="row" colspan="3">Total</th><td><strong>${escape(total)}</strong></td></tr></tfoot>
      </table>
    </section>`;
}

function testCardList(): string {
  return `
      <details>
        <summary>Test card numbers</summary>
        <ul>
          <li><strong>4242 4242 4242 4242</strong>: the payment goes through.</li>
          <li><strong>4000 0000 0000 0002</strong>: the card is declined.</li>
          <li><strong>4000 0000 0000 9995</strong>: declined for insufficient funds.</li>
          <li><strong>4000 0027 6000 3184</strong>: asks for an authentication step first.</li>
          <li>Any other valid card number goes through, like 4242 4242 4242 4242.</li>
        </ul>
      </details>`;
}

function field(name: CardField, label: string, hint: string, autocomplete: string, value: string | undefined, error: string | undefined): string {
  const describedBy = `${name}-hint${error ? ` ${name}-error` : ''}`;
  return `
        <div class="field">
          <label for="${name}">${escape(label)}</label>
          <p class="hint" id="${name}-hint">${escape(hint)}</p>
          ${error ? `<p class="field-error" id="${name}-error">Error: ${escape(error)}</p>` : ''}
          <input id="${name}" name="${name}" type="text" inputmode="numeric" autocomplete="${autocomplete}" required
            aria-describedby="${describedBy}"${error ? ' aria-invalid="true"' : ''} value="${escape(value ?? '')}">
        </div>`;
}

function document(title: string, main: string): string {
  return `<!doctype html>
<html lang="en">
<head>
  <meta charset="utf-8">
  <meta name="viewport" content="width=device-width, initial-scale=1">
  <title>${escape(title)}</title>
  <link rel="stylesheet" href="${PAY_PAGE_STYLESHEET}">
</head>
<body>
  <header class="banner">
    <p><strong>Local test payment page — no real money moves.</strong> This page stands in for the payment provider while Flowlore is developed and tested. Use a test card only.</p>
  </header>
  <main>${main}
  </main>
</body>
</html>
`;
}

/** An amount in minor units, shown in its currency (cents to dollars, yen as they are). */
export function money(amountMinor: number, currency: string): string {
  const format = new Intl.NumberFormat('en-US', { style: 'currency', currency: currency.toUpperCase() });
  const digits = format.resolvedOptions().maximumFractionDigits ?? 2;
  return format.format(amountMinor / 10 ** digits);
}

export function escape(text: string): string {
  return text.replace(/[&<>"']/g, (char) => `&#${char.charCodeAt(0)};`);
}

export const PAY_PAGE_CSS = `
:root { color-scheme: light; font-family: system-ui, sans-serif; line-height: 1.5; color: #1b1b1b; background: #fafafa; }
body { margin: 0; }
.banner { background: #fff4c2; border-bottom: 3px solid #6b5400; padding: 0.75rem 1rem; }
.banner p { margin: 0; max-width: 40rem; }
main { max-width: 40rem; margin: 0 auto; padding: 1rem; }
h1 { font-size: 1.6rem; }
h2 { font-size: 1.2rem; margin-top: 1.5rem; }
table { border-collapse: collapse; width: 100%; }
th, td { text-align: left; padding: 0.4rem; border-bottom: 1px solid #8a8a8a; }
.field { margin: 1rem 0; }
label { display: block; font-weight: 600; }
.hint { margin: 0.1rem 0; color: #3d3d3d; }
.field-error { margin: 0.1rem 0; font-weight: 600; color: #8a1414; }
input { font: inherit; padding: 0.45rem; border: 2px solid #4a4a4a; border-radius: 4px; width: 100%; max-width: 20rem; box-sizing: border-box; }
input[aria-invalid="true"] { border-color: #8a1414; border-width: 3px; }
.notice { border-left: 6px solid #4a4a4a; background: #fff; padding: 0.5rem 1rem; margin: 1rem 0; }
.notice-problem { border-left-color: #8a1414; }
.actions { display: flex; gap: 1rem; align-items: center; flex-wrap: wrap; margin-top: 1.5rem; }
button { font: inherit; font-weight: 600; padding: 0.6rem 1.2rem; border: 2px solid #0b3d6b; border-radius: 4px; background: #0b3d6b; color: #fff; cursor: pointer; }
button.secondary { background: #fff; color: #0b3d6b; }
a { color: #0b3d6b; }
:focus-visible { outline: 3px solid #1a1a1a; outline-offset: 2px; }
`;
