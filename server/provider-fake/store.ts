import { newId } from './ids';
import type {
  CardDetails,
  ChargeObject,
  CheckoutSessionObject,
  EventObject,
  EventType,
  LineItemObject,
  PaymentIntentObject,
  ProviderEvent,
  RefundObject,
  RequestContext,
} from './resources';

/** A card attempt waiting on the pay page's authentication step (the full number is never kept). */
export interface PendingAuthentication {
  readonly attemptId: string;
  readonly card: CardDetails;
}

export interface SessionRecord {
  readonly session: CheckoutSessionObject;
  readonly lineItems: readonly LineItemObject[];
  /** The payment intent of the first attempt; reused by later attempts, linked to the session once paid. */
  attemptIntentId: string | null;
  pendingAuthentication: PendingAuthentication | null;
  /** `payment_intent_data` of the create call: copied onto the payment intent. */
  readonly paymentIntentData: { readonly metadata: Record<string, string>; readonly description: string | null };
}

/**
 * Everything the fake knows, in memory. One clock for all of it: `nowMs()` is the injected clock plus
 * an offset that tests may move forward (`advanceClock`) to reach an expiry without waiting.
 */
export class ProviderStore {
  readonly sessions = new Map<string, SessionRecord>();
  readonly paymentIntents = new Map<string, PaymentIntentObject>();
  readonly charges = new Map<string, ChargeObject>();
  readonly refunds = new Map<string, RefundObject>();
  readonly events = new Map<string, ProviderEvent>();
  /** While true, every /v1 call is answered 503 (the "provider down" path). */
  down = false;
  private clockOffsetMs = 0;
  private readonly eventListeners: ((event: ProviderEvent) => void)[] = [];

  constructor(
    private readonly clock: () => number,
    readonly apiVersion: string,
  ) {}

  nowMs(): number {
    return this.clock() + this.clockOffsetMs;
  }

  nowSeconds(): number {
    return Math.floor(this.nowMs() / 1000);
  }

  advanceClock(ms: number): void {
    this.clockOffsetMs += ms;
  }

  onEvent(listener: (event: ProviderEvent) => void): void {
    this.eventListeners.push(listener);
  }

  /** Records an event with a snapshot of the object as it is now, then hands it to the listeners. */
  emit(type: EventType, object: EventObject, request: RequestContext, previousAttributes?: Record<string, unknown>): ProviderEvent {
    const event: ProviderEvent = {
      id: newId('evt'),
      object: 'event',
      api_version: this.apiVersion,
      created: this.nowSeconds(),
      data: { object: structuredClone(object), ...(previousAttributes ? { previous_attributes: previousAttributes } : {}) },
      livemode: false,
      pending_webhooks: 0,
      request: { ...request },
      type,
    };
    this.events.set(event.id, event);
    for (const listener of this.eventListeners) listener(event);
    return event;
  }
}
