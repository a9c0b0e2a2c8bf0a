import { parseForm } from './form-body';

// The SDK's encoding (stripe 23.1.0, cjs/utils.js stringifyRequestData): nested keys in brackets,
// arrays as indexed keys, values percent-encoded.
describe('parseForm', () => {
  it('nests bracket keys and turns indexed keys into arrays', () => {
    const form = parseForm(
      'mode=payment&line_items[0][price_data][unit_amount]=2500&line_items[0][quantity]=3' +
        '&line_items[1][quantity]=1&metadata[order]=42&expand[0]=payment_intent&success_url=http%3A%2F%2Fx%2F%3Fid%3D%7BCHECKOUT_SESSION_ID%7D',
    );
    expect(form).toEqual({
      mode: 'payment',
      line_items: [{ price_data: { unit_amount: '2500' }, quantity: '3' }, { quantity: '1' }],
      metadata: { order: '42' },
      expand: ['payment_intent'],
      success_url: 'http://x/?id={CHECKOUT_SESSION_ID}',
    });
  });

  it('appends with empty brackets and reads encoded brackets and plus signs', () => {
    expect(parseForm('expand[]=a&expand[]=b&name=Larkfield+Flow+Lab&metadata%5Bshop%5D=7')).toEqual({
      expand: ['a', 'b'],
      name: 'Larkfield Flow Lab',
      metadata: { shop: '7' },
    });
  });

  it('drops keys that would reach the object prototype, and malformed keys', () => {
    const form = parseForm('__proto__[polluted]=1&a[constructor][x]=1&b[=2&ok=yes');
    expect(form).toEqual({ ok: 'yes' });
    expect(({} as Record<string, unknown>)['polluted']).toBeUndefined();
  });
});
