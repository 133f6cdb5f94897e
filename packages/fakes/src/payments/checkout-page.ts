import express, { type Request, type Response, type Router } from 'express';
import { ApiError } from './api-error';
import { parseParams } from './form-params';
import { formatAmount } from './money';
import type { CheckoutSession } from './objects';
import type { CardDetails, PaymentStore, SessionRecord } from './store';
import { passesLuhn, TEST_CARDS } from './test-cards';

/**
 * The hosted payment page that a checkout session's `url` points at (`/pay/<session id>`):
 * our own plain, mobile-first form. Test card numbers behave as the provider documents;
 * a decline keeps the session open for another card; success redirects (303) to success_url
 * with {CHECKOUT_SESSION_ID} filled in. Status codes: 200 page, 303 paid, 402 declined,
 * 422 field errors, 404 unknown session, 410 expired.
 */
export interface CheckoutPageOptions {
  store: PaymentStore;
  now: () => number;
}

type Field = 'card_number' | 'expiry' | 'cvc' | 'name';
type FieldErrors = Partial<Record<Field, string>>;
interface FormValues {
  card_number: string;
  expiry: string;
  cvc: string;
  name: string;
}

const esc = (s: string): string =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);

const formatCardNumber = (n: string): string => n.replace(/(\d{4})(?=\d)/g, '$1 ');

export function validateCard(values: FormValues, nowMs: number): { card?: CardDetails; errors: FieldErrors } {
  const errors: FieldErrors = {};
  const digits = values.card_number.replace(/[\s-]/g, '');
  if (!digits) errors.card_number = 'Enter the card number.';
  else if (!/^\d{13,19}$/.test(digits)) errors.card_number = 'A card number has 13 to 19 digits.';
  else if (!passesLuhn(digits)) errors.card_number = 'This card number is not valid: check the digits.';
  const match = /^\s*(\d{1,2})\s*\/\s*(\d{2}|\d{4})\s*$/.exec(values.expiry);
  let expMonth = 0;
  let expYear = 0;
  if (!values.expiry.trim()) errors.expiry = 'Enter the expiry date as MM/YY.';
  else if (!match) errors.expiry = 'Write the expiry date as MM/YY, for example 04/29.';
  else {
    expMonth = Number(match[1]);
    expYear = match[2]!.length === 2 ? 2000 + Number(match[2]) : Number(match[2]);
    const now = new Date(nowMs);
    const current = now.getUTCFullYear() * 12 + now.getUTCMonth() + 1;
    // A card is valid to the end of its expiry month.
    if (expMonth < 1 || expMonth > 12) errors.expiry = 'The month must be between 01 and 12.';
    else if (expYear * 12 + expMonth < current) errors.expiry = 'This expiry date is in the past.';
    else if (expYear > now.getUTCFullYear() + 50) errors.expiry = 'This expiry year is too far ahead.';
  }
  if (!values.cvc.trim()) errors.cvc = 'Enter the security code.';
  else if (!/^\d{3,4}$/.test(values.cvc.trim())) errors.cvc = 'The security code is 3 or 4 digits.';
  const name = values.name.trim();
  if (!name) errors.name = 'Enter the name on the card.';
  else if (name.length > 200) errors.name = 'The name can be at most 200 characters.';
  if (Object.keys(errors).length > 0) return { errors };
  return { card: { number: digits, expMonth, expYear, name }, errors };
}

function payeeOf(record: SessionRecord): string {
  return record.session.metadata?.payee_name || record.lineItems[0]?.name || 'Test merchant';
}

const STYLE = `
*{box-sizing:border-box}
body{margin:0;font:16px/1.5 system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;color:#1a1c2b;background:#f3f1ea}
.banner{margin:0;padding:.6rem 1rem;background:#2d2a5c;color:#fff;font-weight:600;text-align:center}
main{max-width:30rem;margin:0 auto;padding:1rem}
.card{background:#fff;border:1px solid #d9d5c7;border-radius:.75rem;padding:1.25rem;margin-top:1rem}
h1{font-size:1.35rem;margin:.25rem 0 .5rem}
.amount{font-size:2rem;font-weight:700;margin:.25rem 0}
ul.items{list-style:none;padding:0;margin:.5rem 0 0;color:#454857}
ul.items li{display:flex;justify-content:space-between;gap:1rem}
label{display:block;font-weight:600;margin-top:1rem}
.hint{display:block;font-weight:400;color:#555a6e;font-size:.9rem}
input{display:block;width:100%;font:inherit;padding:.65rem .75rem;margin-top:.3rem;border:2px solid #6b6f85;border-radius:.5rem;background:#fff;color:inherit}
input:focus,button:focus,a:focus,summary:focus{outline:3px solid #e0a100;outline-offset:2px}
input[aria-invalid=true]{border-color:#b3261e}
.row{display:flex;gap:.75rem;align-items:flex-end}.row>div{flex:1}
.field-error{color:#b3261e;font-weight:600;margin:.25rem 0 0}
.problem{border:2px solid #b3261e;border-radius:.5rem;padding:.75rem 1rem;background:#fdf0ef;margin-top:1rem}
.problem h2{font-size:1.05rem;margin:0 0 .25rem}
button{display:block;width:100%;margin-top:1.5rem;padding:.85rem;font:inherit;font-weight:700;color:#fff;background:#2d2a5c;border:0;border-radius:.5rem;cursor:pointer}
.cancel{display:inline-block;margin-top:1rem;color:#2d2a5c}
details{margin-top:1.25rem;color:#454857}
code{font-size:.95rem}
`;

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${esc(title)} · Test payment page</title><style>${STYLE}</style></head><body><p class="banner" role="note">Test payment page — no real money moves</p><main>${body}</main></body></html>`;
}

function summary(record: SessionRecord): string {
  const s = record.session;
  const currency = s.currency ?? 'gbp';
  const items = record.lineItems
    .map(
      (li) =>
        `<li><span>${esc(li.name)}${li.quantity > 1 ? ` × ${li.quantity}` : ''}${li.description ? `<span class="hint">${esc(li.description)}</span>` : ''}</span><span>${esc(formatAmount(li.unitAmount * li.quantity, currency))}</span></li>`,
    )
    .join('');
  return `<section class="card" aria-labelledby="pay-heading"><h1 id="pay-heading">Pay ${esc(payeeOf(record))}</h1><p class="amount">${esc(formatAmount(s.amount_total ?? 0, currency))}</p><ul class="items" aria-label="What you are paying for">${items}</ul></section>`;
}

const FIELDS: readonly {
  name: Field;
  id: string;
  label: string;
  hint?: string;
  autocomplete: string;
  inputmode?: string;
  maxlength: number;
}[] = [
  {
    name: 'card_number',
    id: 'card-number',
    label: 'Card number',
    autocomplete: 'cc-number',
    inputmode: 'numeric',
    maxlength: 23,
  },
  { name: 'expiry', id: 'expiry', label: 'Expiry date', hint: 'MM/YY', autocomplete: 'cc-exp', maxlength: 7 },
  {
    name: 'cvc',
    id: 'cvc',
    label: 'Security code',
    hint: '3 or 4 digits',
    autocomplete: 'cc-csc',
    inputmode: 'numeric',
    maxlength: 4,
  },
  { name: 'name', id: 'name', label: 'Name on card', autocomplete: 'cc-name', maxlength: 200 },
];

function field(f: (typeof FIELDS)[number], value: string, error: string | undefined): string {
  const described = [f.hint ? `${f.id}-hint` : '', error ? `${f.id}-error` : ''].filter(Boolean).join(' ');
  return `<div><label for="${f.id}">${esc(f.label)}${f.hint ? ` <span class="hint" id="${f.id}-hint">${esc(f.hint)}</span>` : ''}</label><input id="${f.id}" name="${f.name}" type="text" autocomplete="${f.autocomplete}"${f.inputmode ? ` inputmode="${f.inputmode}"` : ''} maxlength="${f.maxlength}" value="${esc(value)}" required${error ? ' aria-invalid="true"' : ''}${described ? ` aria-describedby="${described}"` : ''}>${error ? `<p class="field-error" id="${f.id}-error">${esc(error)}</p>` : ''}</div>`;
}

function paymentForm(record: SessionRecord, values: FormValues, errors: FieldErrors, problem?: string): string {
  const s = record.session;
  const errorList = FIELDS.filter((f) => errors[f.name]).map(
    (f) => `<li><a href="#${f.id}">${esc(errors[f.name] ?? '')}</a></li>`,
  );
  const alert = problem
    ? `<div class="problem" role="alert"><h2>The payment did not go through</h2><p>${esc(problem)} Nothing has been taken. You can try another card.</p></div>`
    : errorList.length
      ? `<div class="problem" role="alert"><h2>Please check the card details</h2><ul>${errorList.join('')}</ul></div>`
      : '';
  const [num, exp, cvc, name] = FIELDS as [
    (typeof FIELDS)[number],
    (typeof FIELDS)[number],
    (typeof FIELDS)[number],
    (typeof FIELDS)[number],
  ];
  const tests = Object.entries(TEST_CARDS)
    .map(([n, c]) => `<li><code>${formatCardNumber(n)}</code> ${esc(c.label)}</li>`)
    .join('');
  return page(
    `Pay ${payeeOf(record)}`,
    `${summary(record)}${alert}<section class="card" aria-labelledby="card-heading"><h2 id="card-heading">Card details</h2><form method="post" action="/pay/${encodeURIComponent(s.id)}" novalidate>${field(num, values.card_number, errors.card_number)}<div class="row">${field(exp, values.expiry, errors.expiry)}${field(cvc, values.cvc, errors.cvc)}</div>${field(name, values.name, errors.name)}<button type="submit">Pay ${esc(formatAmount(s.amount_total ?? 0, s.currency ?? 'gbp'))}</button></form>${s.cancel_url ? `<a class="cancel" href="${esc(s.cancel_url)}">Cancel and go back</a>` : ''}<details><summary>Test card numbers</summary><p>Use any future expiry date, any 3-digit security code and any name.</p><ul>${tests}</ul></details></section>`,
  );
}

function statePage(session: CheckoutSession): { status: number; html: string } {
  if (session.status === 'complete') {
    const link = session.success_url ? `<p><a href="${esc(successUrl(session))}">Continue</a></p>` : '';
    return {
      status: 200,
      html: page(
        'Payment complete',
        `<section class="card"><h1>Payment complete</h1><p>This payment has been made. Thank you.</p>${link}</section>`,
      ),
    };
  }
  const back = session.cancel_url ? `<p><a href="${esc(session.cancel_url)}">Go back</a></p>` : '';
  return {
    status: 410,
    html: page(
      'Payment page expired',
      `<section class="card"><h1>This payment page has expired</h1><p>Nothing has been taken. Ask for a new payment link.</p>${back}</section>`,
    ),
  };
}

function successUrl(session: CheckoutSession): string {
  return (session.success_url ?? '').split('{CHECKOUT_SESSION_ID}').join(session.id);
}

export function checkoutPageRoutes({ store, now }: CheckoutPageOptions): Router {
  const router = express.Router();
  const empty: FormValues = { card_number: '', expiry: '', cvc: '', name: '' };

  const load = (req: Request, res: Response): SessionRecord | undefined => {
    try {
      return store.sessionRecord(String(req.params.sessionId));
    } catch (err) {
      if (!(err instanceof ApiError)) throw err;
      res
        .status(404)
        .type('html')
        .send(
          page(
            'Not found',
            '<section class="card"><h1>No such payment</h1><p>This payment link is not known. Check the link you were sent.</p></section>',
          ),
        );
      return undefined;
    }
  };

  router.get('/pay/:sessionId', (req, res) => {
    const record = load(req, res);
    if (!record) return;
    if (record.session.status !== 'open') {
      const state = statePage(record.session);
      res.status(state.status).type('html').send(state.html);
      return;
    }
    res.type('html').send(paymentForm(record, empty, {}));
  });

  router.post('/pay/:sessionId', express.text({ type: 'application/x-www-form-urlencoded', limit: '32kb' }), (req, res) => {
    const record = load(req, res);
    if (!record) return;
    if (record.session.status !== 'open') {
      const state = statePage(record.session);
      res.status(state.status).type('html').send(state.html);
      return;
    }
    const form = parseParams(typeof req.body === 'string' ? req.body : '');
    const text = (k: Field) => (typeof form[k] === 'string' ? form[k] : '');
    const values: FormValues = { card_number: text('card_number'), expiry: text('expiry'), cvc: text('cvc'), name: text('name') };
    const { card, errors } = validateCard(values, now());
    if (!card) {
      res
        .status(422)
        .type('html')
        .send(paymentForm(record, values, errors));
      return;
    }
    const result = store.pay(record.session.id, card);
    if (result.kind === 'succeeded') {
      if (result.session.success_url) {
        res.redirect(303, successUrl(result.session));
      } else {
        res.status(200).type('html').send(statePage(result.session).html);
      }
      return;
    }
    if (result.kind === 'not_open') {
      const state = statePage(result.session);
      res.status(state.status).type('html').send(state.html);
      return;
    }
    // The card fields are cleared after a decline; the name stays.
    res
      .status(402)
      .type('html')
      .send(paymentForm(record, { ...empty, name: values.name }, {}, result.message));
  });
  return router;
}
