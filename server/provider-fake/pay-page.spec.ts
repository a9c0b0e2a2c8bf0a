import { JSDOM } from 'jsdom';
import request from 'supertest';

import { createProviderFake, type ProviderFake } from './provider-fake';

/*
 * The hosted pay page, through HTTP only (no browser). Card outcomes follow the provider's public
 * test card numbers (its testing docs, from memory): 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is
 * declined, 4000 0000 0000 9995 has insufficient funds, 4000 0027 6000 3184 asks for authentication.
 */

const SECRET_KEY = 'sk_test_flowlore_pay_page_0123456789';
const SUCCESS_URL = 'http://127.0.0.1:4000/seats/thanks?session_id={CHECKOUT_SESSION_ID}';
const CANCEL_URL = 'http://127.0.0.1:4000/seats';

let fake: ProviderFake;

beforeAll(() => {
  fake = createProviderFake({ secretKey: SECRET_KEY });
});

async function newSession(): Promise<{ id: string; url: string }> {
  const response = await request(fake.app)
    .post('/v1/checkout/sessions')
    .set('Authorization', `Bearer ${SECRET_KEY}`)
    .type('form')
    .send({
      mode: 'payment',
      success_url: SUCCESS_URL,
      cancel_url: CANCEL_URL,
      'line_items[0][quantity]': '3',
      'line_items[0][price_data][currency]': 'usd',
      'line_items[0][price_data][unit_amount]': '2500',
      'line_items[0][price_data][product_data][name]': 'Course seat',
      'line_items[1][quantity]': '1',
      'line_items[1][price_data][currency]': 'usd',
      'line_items[1][price_data][unit_amount]': '900',
      'line_items[1][price_data][product_data][name]': 'Printed workbook',
    })
    .expect(200);
  return { id: response.body.id, url: new URL(response.body.url).pathname };
}

function pay(path: string, cardNumber: string, expiry = '12 / 40', cvc = '123') {
  return request(fake.app).post(path).type('form').send({ card_number: cardNumber, card_expiry: expiry, card_cvc: cvc });
}

function page(html: string): Document {
  return new JSDOM(html).window.document;
}

function text(node: Element | Document | null | undefined): string {
  return (node?.textContent ?? '').replace(/\s+/g, ' ').trim();
}

function session(id: string) {
  return fake.state.sessions.get(id)?.session;
}

describe('the pay page', () => {
  it('lists the items and the total, is marked as a local test page, and labels every field', async () => {
    const { url } = await newSession();
    const response = await request(fake.app).get(url).expect(200).expect('Content-Type', /html/);
    const doc = page(response.text);
    expect(text(doc.querySelector('.banner'))).toContain('Local test payment page — no real money moves.');
    expect(text(doc.querySelector('h1'))).toBe('Pay Flowlore');
    const rows = [...doc.querySelectorAll('tbody tr')].map((row) => [...row.children].map((cell) => text(cell)));
    expect(rows).toEqual([
      ['Course seat', '3', '$25.00', '$75.00'],
      ['Printed workbook', '1', '$9.00', '$9.00'],
    ]);
    // 3 × $25.00 + $9.00
    expect([...(doc.querySelector('tfoot tr')?.children ?? [])].map((cell) => text(cell))).toEqual(['Total', '$84.00']);
    for (const input of doc.querySelectorAll('input:not([type=hidden])')) {
      expect(text(doc.querySelector(`label[for="${input.id}"]`))).not.toBe('');
    }
    expect(text(doc.querySelector('button[type=submit]'))).toBe('Pay $84.00');
    expect(response.headers['content-security-policy']).toContain("default-src 'none'");
  });

  it('pays with 4242 and sends the browser to success_url with the session id', async () => {
    const { id, url } = await newSession();
    const response = await pay(url, '4242 4242 4242 4242').expect(303);
    expect(response.headers['location']).toBe(`http://127.0.0.1:4000/seats/thanks?session_id=${id}`);
    expect(session(id)).toMatchObject({ status: 'complete', payment_status: 'paid' });
    const again = await request(fake.app).get(url).expect(200);
    expect(text(page(again.text).querySelector('h1'))).toBe('This payment is complete');
  });

  it('pays with any other valid card number, like 4242', async () => {
    const { id, url } = await newSession();
    // A Luhn-valid number that is not on the test card list
    await pay(url, '5555 5555 5555 4444').expect(303);
    expect(session(id)?.payment_status).toBe('paid');
  });

  it('says a 0002 card was declined and leaves the session open', async () => {
    const { id, url } = await newSession();
    const response = await pay(url, '4000 0000 0000 0002').expect(200);
    const alert = page(response.text).querySelector('[role=alert]');
    expect(text(alert)).toContain('Payment not made');
    expect(text(alert)).toContain('Your card was declined.');
    expect(session(id)).toMatchObject({ status: 'open', payment_status: 'unpaid' });
  });

  it('says a 9995 card has insufficient funds', async () => {
    const { id, url } = await newSession();
    const response = await pay(url, '4000000000009995').expect(200);
    expect(text(page(response.text).querySelector('[role=alert]'))).toContain('Your card has insufficient funds.');
    expect(session(id)?.status).toBe('open');
  });

  it('asks for authentication with 3184; approving pays', async () => {
    const { id, url } = await newSession();
    const step = await pay(url, '4000 0027 6000 3184').expect(200);
    const doc = page(step.text);
    expect(text(doc.querySelector('h1'))).toBe('Authentication step (test)');
    expect(session(id)?.payment_status).toBe('unpaid');
    const attempt = doc.querySelector<HTMLInputElement>('input[name=attempt]')?.value;
    const approved = await request(fake.app).post(`${url}/authenticate`).type('form').send({ attempt, decision: 'approve' }).expect(303);
    expect(approved.headers['location']).toContain(id);
    expect(session(id)).toMatchObject({ status: 'complete', payment_status: 'paid' });
    const intent = fake.state.paymentIntents.get(session(id)?.payment_intent as string);
    expect(fake.state.charges.get(intent?.latest_charge as string)?.payment_method_details.card.three_d_secure).toEqual({ result: 'authenticated' });
  });

  it('asks for authentication with 3184; failing it does not pay, and the answer counts once', async () => {
    const { id, url } = await newSession();
    const step = await pay(url, '4000 0027 6000 3184').expect(200);
    const attempt = page(step.text).querySelector<HTMLInputElement>('input[name=attempt]')?.value;
    const failed = await request(fake.app).post(`${url}/authenticate`).type('form').send({ attempt, decision: 'fail' }).expect(200);
    expect(text(page(failed.text).querySelector('[role=alert]'))).toContain('unable to authenticate');
    expect(session(id)).toMatchObject({ status: 'open', payment_status: 'unpaid' });
    await request(fake.app).post(`${url}/authenticate`).type('form').send({ attempt, decision: 'approve' }).expect(409);
    expect(session(id)?.payment_status).toBe('unpaid');
  });

  it('returns to cancel_url on cancel and leaves the session open', async () => {
    const { id, url } = await newSession();
    const cancelHref = page((await request(fake.app).get(url)).text).querySelector('a[href$="/cancel"]')?.getAttribute('href');
    const response = await request(fake.app).get(cancelHref as string).expect(303);
    expect(response.headers['location']).toBe(CANCEL_URL);
    expect(session(id)?.status).toBe('open');
  });

  it('shows each field problem beside its field', async () => {
    const { id, url } = await newSession();
    const response = await pay(url, '4242 4242 4242 4241', '13/30', '1').expect(422);
    const doc = page(response.text);
    for (const name of ['card_number', 'card_expiry', 'card_cvc']) {
      const input = doc.getElementById(name);
      expect(input?.getAttribute('aria-invalid')).toBe('true');
      expect(text(doc.getElementById(`${name}-error`))).toMatch(/^Error: /);
      expect(input?.getAttribute('aria-describedby')).toContain(`${name}-error`);
    }
    expect(session(id)?.status).toBe('open');
  });

  it('says an expired session can no longer be paid', async () => {
    const { id, url } = await newSession();
    await request(fake.app).post(`/v1/checkout/sessions/${id}/expire`).set('Authorization', `Bearer ${SECRET_KEY}`).expect(200);
    const response = await pay(url, '4242 4242 4242 4242').expect(200);
    expect(text(page(response.text).querySelector('h1'))).toBe('This checkout has expired');
    expect(session(id)?.payment_status).toBe('unpaid');
  });

  it('answers an unknown session with a 404 page', async () => {
    await request(fake.app).get('/pay/cs_test_unknown').expect(404).expect(/No such checkout/);
  });
});
