import { formatAmount, parseSeatTiers, quoteSeats, type SeatPricing } from './pricing';

const pricing: SeatPricing = {
  currency: 'usd',
  tiers: [
    { fromSeats: 1, unitAmount: 4900 },
    { fromSeats: 10, unitAmount: 4400 },
    { fromSeats: 50, unitAmount: 3900 },
  ],
};

describe('seat pricing', () => {
  it('prices the whole order at the tier its quantity reaches, in integer cents', () => {
    expect(quoteSeats(pricing, 1)).toEqual({ quantity: 1, unitAmount: 4900, totalAmount: 4900, currency: 'usd', tierFrom: 1 });
    expect(quoteSeats(pricing, 9).totalAmount).toBe(44_100);
    expect(quoteSeats(pricing, 10)).toMatchObject({ unitAmount: 4400, totalAmount: 44_000, tierFrom: 10 });
    expect(quoteSeats(pricing, 49).totalAmount).toBe(215_600);
    expect(quoteSeats(pricing, 500)).toMatchObject({ unitAmount: 3900, totalAmount: 1_950_000, tierFrom: 50 });
    for (let n = 1; n <= 500; n++) expect(Number.isSafeInteger(quoteSeats(pricing, n).totalAmount)).toBe(true);
  });

  it('refuses 0, 501 and fractions of a seat', () => {
    for (const n of [0, 501, 2.5, Number.NaN]) expect(() => quoteSeats(pricing, n)).toThrow(RangeError);
  });

  it('reads tiers from configuration text and says what is wrong', () => {
    expect(parseSeatTiers('1:4900, 10:4400,50:3900')).toEqual(pricing.tiers);
    expect(parseSeatTiers('')).toMatch(/at least one tier/);
    expect(parseSeatTiers('2:4900')).toMatch(/start at 1 seat/);
    expect(parseSeatTiers('1:4900,10:4400,10:3900')).toMatch(/go up/);
    expect(parseSeatTiers('1:49.00')).toMatch(/seats:cents/);
    expect(parseSeatTiers('1:30')).toMatch(/at least 50/);
    expect(parseSeatTiers('1:4900,600:100')).toMatch(/above 500/);
  });

  it('formats amounts as money through Intl (a general-purpose reference, ECMA-402)', () => {
    expect(formatAmount(4900, 'usd')).toBe('$49.00');
    expect(formatAmount(1_950_000, 'usd')).toBe('$19,500.00');
    expect(formatAmount(4400, 'eur', 'en-GB')).toBe('€44.00');
  });
});
