import { createHmac } from 'node:crypto';

import { newId } from './ids';
import type { ProviderEvent } from './resources';
import type { ProviderStore } from './store';

/** Where events go and how hard the fake tries. */
export interface WebhookOptions {
  /** The app's webhook endpoint; without it events are only recorded. */
  readonly url?: string;
  /** The endpoint's signing secret (`whsec_…`). */
  readonly secret?: string;
  /** Wait before the first retry; each next wait doubles. Default 1000 ms (tests use ~50 ms). */
  readonly retryBaseMs?: number;
  /** Tries per delivery, the first one included. Default 5. */
  readonly maxAttempts?: number;
  /** How long one try may take. Default 10 s. */
  readonly timeoutMs?: number;
  /** The clock for signature timestamps. Default the real one, whatever the store's clock says. */
  readonly signingNow?: () => number;
}

/** One try to deliver one event, as the test controls list them. */
export interface DeliveryRecord {
  readonly id: string;
  readonly eventId: string;
  readonly eventType: string;
  readonly attempt: number;
  readonly atMs: number;
  readonly signatureTimestamp: number;
  /** The endpoint's HTTP status; null when the request failed (refused connection, timeout). */
  readonly status: number | null;
  readonly error: string | null;
  readonly ok: boolean;
}

/** How one delivery departs from the normal: wait first, or sign as if sent 400 s ago (past the 300 s tolerance). */
export interface DeliveryTweaks {
  readonly delayMs?: number;
  readonly staleTimestamp?: boolean;
}

export type ReleaseOrder = 'as_sent' | 'reverse' | 'shuffle';

// The SDK's default tolerance is 300 s (stripe 23.1.0, cjs/Webhooks.js DEFAULT_TOLERANCE); 400 s is past it.
export const STALE_BY_S = 400;

/**
 * The provider's signature header, per its webhook docs: `t=<unix seconds>,v1=<hex HMAC-SHA256 of
 * "<t>.<body>" keyed with the endpoint secret>`.
 */
export function signatureHeader(payload: string, secret: string, timestampS: number): string {
  const signature = createHmac('sha256', secret).update(`${timestampS}.${payload}`, 'utf8').digest('hex');
  return `t=${timestampS},v1=${signature}`;
}

/**
 * Sends events to the one endpoint: POST of the event JSON with a Stripe-Signature header, retried with
 * doubling waits while the answer is not 2xx (the provider retries for days; the fake a few times).
 * Deliveries run side by side, so the order of arrival is not promised, as with the provider.
 */
export class WebhookDispatcher {
  readonly deliveries: DeliveryRecord[] = [];
  private readonly inFlight = new Set<Promise<unknown>>();
  private readonly sleepers = new Set<() => void>();
  private readonly aborts = new Set<AbortController>();
  private readonly nextTweaks: DeliveryTweaks[] = [];
  private held: ProviderEvent[] | null = null;
  private stopped = false;

  constructor(
    private readonly store: ProviderStore,
    private readonly options: WebhookOptions,
  ) {
    store.onEvent((event) => this.enqueue(event));
  }

  get configured(): boolean {
    return Boolean(this.options.url && this.options.secret);
  }

  /** The next `count` new deliveries wait `ms` before their first try. */
  delayNext(ms: number, count = 1): void {
    for (let index = 0; index < count; index++) this.nextTweaks.push({ delayMs: ms });
  }

  /** The next `count` new deliveries carry a timestamp 400 s old, which a receiver must refuse. */
  staleNext(count = 1): void {
    for (let index = 0; index < count; index++) this.nextTweaks.push({ staleTimestamp: true });
  }

  /** From now on new events wait, undelivered, until `release`. */
  hold(): void {
    this.held ??= [];
  }

  /** Delivers the held events one after another in the order asked, then delivers as usual again. */
  release(order: ReleaseOrder = 'as_sent'): Promise<DeliveryRecord[]> {
    const events = this.held ?? [];
    this.held = null;
    return this.sendInOrder(arrange(events, order));
  }

  /** Delivers an event again, `times` times one after another (the provider may deliver an event more than once). */
  redeliver(eventId: string, times = 1, tweaks: DeliveryTweaks = {}): Promise<DeliveryRecord[]> {
    const event = this.event(eventId);
    return this.track(
      (async () => {
        const records: DeliveryRecord[] = [];
        for (let index = 0; index < times; index++) records.push(...(await this.deliver(event, tweaks)));
        return records;
      })(),
    );
  }

  /** Delivers the listed events again one after another in the order given (or shuffled: never the order given). */
  redeliverBatch(eventIds: readonly string[], shuffle = false): Promise<DeliveryRecord[]> {
    const events = eventIds.map((id) => this.event(id));
    return this.sendInOrder(shuffle ? arrange(events, 'shuffle') : events);
  }

  /** Resolves once no delivery is under way or waiting to retry. */
  async idle(): Promise<void> {
    while (this.inFlight.size) await Promise.allSettled([...this.inFlight]);
  }

  /** Stops retries and in-flight tries; resolves once they have ended. */
  async stop(): Promise<void> {
    this.stopped = true;
    for (const wake of this.sleepers) wake();
    for (const abort of this.aborts) abort.abort();
    await this.idle();
  }

  private event(eventId: string): ProviderEvent {
    const event = this.store.events.get(eventId);
    if (!event) throw new Error(`No such event: ${eventId}`);
    return event;
  }

  private enqueue(event: ProviderEvent): void {
    if (!this.configured || this.stopped) return;
    event.pending_webhooks = 1;
    if (this.held) {
      this.held.push(event);
      return;
    }
    void this.track(this.deliver(event, this.nextTweaks.shift() ?? {}));
  }

  private sendInOrder(events: readonly ProviderEvent[]): Promise<DeliveryRecord[]> {
    return this.track(
      (async () => {
        const records: DeliveryRecord[] = [];
        for (const event of events) records.push(...(await this.deliver(event, {})));
        return records;
      })(),
    );
  }

  private track<T>(work: Promise<T>): Promise<T> {
    this.inFlight.add(work);
    const forget = () => this.inFlight.delete(work);
    work.then(forget, forget);
    return work;
  }

  /** One delivery: tries until a 2xx answer or `maxAttempts`, waiting base, 2×base, 4×base… between. */
  private async deliver(event: ProviderEvent, tweaks: DeliveryTweaks): Promise<DeliveryRecord[]> {
    const records: DeliveryRecord[] = [];
    if (!this.configured) return records;
    if (tweaks.delayMs) await this.sleep(tweaks.delayMs);
    const maxAttempts = this.options.maxAttempts ?? 5;
    const baseMs = this.options.retryBaseMs ?? 1000;
    for (let attempt = 1; attempt <= maxAttempts && !this.stopped; attempt++) {
      const record = await this.tryOnce(event, attempt, tweaks.staleTimestamp ?? false);
      records.push(record);
      this.deliveries.push(record);
      if (record.ok) {
        event.pending_webhooks = 0;
        break;
      }
      if (attempt < maxAttempts) await this.sleep(baseMs * 2 ** (attempt - 1));
    }
    return records;
  }

  private async tryOnce(event: ProviderEvent, attempt: number, stale: boolean): Promise<DeliveryRecord> {
    const payload = JSON.stringify(event, null, 2);
    const signatureTimestamp = Math.floor((this.options.signingNow ?? Date.now)() / 1000) - (stale ? STALE_BY_S : 0);
    const base = { id: newId('whd'), eventId: event.id, eventType: event.type, attempt, atMs: Date.now(), signatureTimestamp };
    const abort = new AbortController();
    this.aborts.add(abort);
    const timer = setTimeout(() => abort.abort(), this.options.timeoutMs ?? 10_000);
    try {
      const response = await fetch(this.options.url as string, {
        method: 'POST',
        headers: {
          'Content-Type': 'application/json; charset=utf-8',
          'Stripe-Signature': signatureHeader(payload, this.options.secret as string, signatureTimestamp),
          'User-Agent': 'flowlore-provider-fake (local test webhooks)',
        },
        body: payload,
        signal: abort.signal,
      });
      await response.arrayBuffer(); // read to the end so the connection is free again
      return { ...base, status: response.status, error: null, ok: response.status >= 200 && response.status < 300 };
    } catch (error) {
      return { ...base, status: null, error: error instanceof Error ? error.message : String(error), ok: false };
    } finally {
      clearTimeout(timer);
      this.aborts.delete(abort);
    }
  }

  private sleep(ms: number): Promise<void> {
    return new Promise((resolve) => {
      const wake = () => {
        clearTimeout(timer);
        this.sleepers.delete(wake);
        resolve();
      };
      const timer = setTimeout(wake, ms);
      this.sleepers.add(wake);
    });
  }
}

function arrange<T>(items: readonly T[], order: ReleaseOrder): T[] {
  if (order === 'as_sent') return [...items];
  if (order === 'reverse' || items.length < 2) return [...items].reverse();
  const shuffled = [...items];
  for (let index = shuffled.length - 1; index > 0; index--) {
    const other = Math.floor(Math.random() * (index + 1));
    [shuffled[index], shuffled[other]] = [shuffled[other] as T, shuffled[index] as T];
  }
  // Out of order means not the order they were sent in.
  return shuffled.every((item, index) => item === items[index]) ? [...items].reverse() : shuffled;
}
