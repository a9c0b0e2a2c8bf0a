/**
 * Seat prices: a price per seat by volume tier, in integer minor units (cents), one currency. The
 * whole order is priced at the tier its quantity reaches (volume pricing, not graduated): 12 seats
 * at a 10-seat tier of 44.00 cost 12 × 44.00. Shared by the server (orders, the provider's line
 * items) and the browser (the price shown before buying), so both say the same amount.
 */
export interface PriceTier {
  /** The smallest order this price applies to. */
  readonly fromSeats: number;
  /** Per seat, in minor units (cents). */
  readonly unitAmount: number;
}

export interface SeatPricing {
  /** ISO 4217, lower case as the provider takes it (`usd`, `eur`, `gbp`). */
  readonly currency: string;
  /** Ascending by `fromSeats`; the first starts at 1. */
  readonly tiers: readonly PriceTier[];
}

/** The prices when configuration sets none (SEAT_PRICES): 49.00 from 1 seat, 44.00 from 10, 39.00 from 50. */
export const DEFAULT_SEAT_PRICES = '1:4900,10:4400,50:3900';

export const MIN_SEATS_PER_ORDER = 1;
export const MAX_SEATS_PER_ORDER = 500;

export interface SeatQuote {
  readonly quantity: number;
  readonly unitAmount: number;
  readonly totalAmount: number;
  readonly currency: string;
  /** The tier applied (its smallest order). */
  readonly tierFrom: number;
}

/** The price of `quantity` seats; throws on a quantity outside 1…500 or not whole. */
export function quoteSeats(pricing: SeatPricing, quantity: number): SeatQuote {
  if (!Number.isInteger(quantity) || quantity < MIN_SEATS_PER_ORDER || quantity > MAX_SEATS_PER_ORDER) {
    throw new RangeError(`A seat order is a whole number from ${MIN_SEATS_PER_ORDER} to ${MAX_SEATS_PER_ORDER}, not ${quantity}.`);
  }
  let tier = pricing.tiers[0]!;
  for (const t of pricing.tiers) if (t.fromSeats <= quantity) tier = t;
  return { quantity, unitAmount: tier.unitAmount, totalAmount: tier.unitAmount * quantity, currency: pricing.currency, tierFrom: tier.fromSeats };
}

/**
 * Tiers from configuration text: `from:cents` pairs separated by commas, e.g. `1:4900,10:4400,50:3900`
 * (49.00 from 1 seat, 44.00 from 10, 39.00 from 50). Returns the reason when the text is not valid.
 */
export function parseSeatTiers(text: string): PriceTier[] | string {
  const tiers: PriceTier[] = [];
  for (const part of text.split(',').map((p) => p.trim()).filter(Boolean)) {
    const match = /^(\d+)\s*:\s*(\d+)$/.exec(part);
    if (!match) return `"${part}" is not "seats:cents" (for example 10:4400).`;
    tiers.push({ fromSeats: Number(match[1]), unitAmount: Number(match[2]) });
  }
  if (tiers.length === 0) return 'Give at least one tier, for example 1:4900.';
  if (tiers[0]!.fromSeats !== 1) return 'The first tier must start at 1 seat.';
  for (let i = 1; i < tiers.length; i++) {
    if (tiers[i]!.fromSeats <= tiers[i - 1]!.fromSeats) return 'Tiers must go up in seats, each starting above the one before.';
  }
  if (tiers.some((t) => t.fromSeats > MAX_SEATS_PER_ORDER)) return `No tier can start above ${MAX_SEATS_PER_ORDER} seats.`;
  // The provider's smallest charge is 50 minor units in the usual currencies (from memory of its docs).
  if (tiers.some((t) => t.unitAmount < 50)) return 'A seat must cost at least 50 minor units (0.50).';
  return tiers;
}

/** An amount for people: `49.00 USD` style through the platform's number formatting, e.g. "$49.00". */
export function formatAmount(minorUnits: number, currency: string, locale = 'en-US'): string {
  return new Intl.NumberFormat(locale, { style: 'currency', currency: currency.toUpperCase() }).format(minorUnits / 100);
}
