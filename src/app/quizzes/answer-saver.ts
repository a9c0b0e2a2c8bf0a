import type { AnswerValue } from '../../../shared/api/quizzes';
import type { Serialised } from './quiz-answers';

/** Where one question's autosave stands, as the question shows it (quietly). */
export type SaveState =
  | { readonly status: 'unchanged' }
  | { readonly status: 'waiting' }
  | { readonly status: 'saving' }
  | { readonly status: 'saved'; readonly at: string }
  /** The connection dropped: the answer is kept here and sent again. */
  | { readonly status: 'retrying'; readonly message: string }
  /** The answer was not taken (not a number, a unit of the wrong kind): what was typed stays, and the last good draft stays saved. */
  | { readonly status: 'refused'; readonly message: string }
  /** The attempt takes no more answers (submitted, or the time is up). */
  | { readonly status: 'closed'; readonly message: string };

/** How a failed save counts: refused (400), worth sending again (no connection, 5xx), or final (409). */
export interface SaveFailure {
  readonly outcome: 'refused' | 'retry' | 'closed';
  readonly message: string;
}

export interface AnswerSaverOptions {
  /** Quiet time after the last change before it is sent. */
  readonly debounceMs: number;
  /** Waits between sends after a dropped connection; the last one repeats. */
  readonly retryDelaysMs: readonly number[];
}

export const DEFAULT_SAVER_OPTIONS: AnswerSaverOptions = { debounceMs: 800, retryDelaysMs: [1000, 2000, 4000, 8000, 15000] };

/**
 * One question's autosave: debounced, one request at a time, the newest answer wins, and a
 * dropped connection sends the answer again (with growing waits, or at once when `retryNow` is
 * called, e.g. when the browser is back online) until it is saved. Nothing typed is lost.
 */
export class AnswerSaver {
  private timer: ReturnType<typeof setTimeout> | undefined;
  private pending: { answer: AnswerValue | null } | undefined;
  private inFlight: Promise<void> | undefined;
  private failures = 0;
  private current: SaveState = { status: 'unchanged' };
  private disposed = false;

  constructor(
    private readonly send: (answer: AnswerValue | null) => Promise<{ savedAt: string }>,
    private readonly classify: (error: unknown) => SaveFailure,
    private readonly onState: (state: SaveState) => void,
    private readonly options: AnswerSaverOptions = DEFAULT_SAVER_OPTIONS,
  ) {}

  get state(): SaveState {
    return this.current;
  }

  /** The form changed: send it after the quiet time (or say at once why it cannot be sent). */
  change(serialised: Serialised): void {
    if (this.disposed || this.current.status === 'closed') return;
    this.clearTimer();
    if (!serialised.ok) {
      this.pending = undefined;
      this.setState({ status: 'refused', message: serialised.message });
      return;
    }
    this.pending = { answer: serialised.answer };
    if (!this.inFlight) this.setState({ status: 'waiting' });
    this.timer = setTimeout(() => this.run(), this.options.debounceMs);
  }

  /** Sends what waits now and resolves when nothing is in flight: saved, refused, closed or (offline) retrying. */
  async flush(): Promise<SaveState> {
    this.clearTimer();
    if (this.pending && !this.inFlight) this.run();
    while (this.inFlight) {
      await this.inFlight;
      if (this.current.status === 'retrying') break;
    }
    return this.current;
  }

  /** A dropped connection came back: send again without waiting out the delay. */
  retryNow(): void {
    if (this.current.status !== 'retrying' || this.inFlight) return;
    this.clearTimer();
    this.run();
  }

  dispose(): void {
    this.disposed = true;
    this.clearTimer();
  }

  private run(): void {
    this.timer = undefined;
    if (this.disposed || this.inFlight || !this.pending) return;
    const { answer } = this.pending;
    this.pending = undefined;
    this.setState({ status: 'saving' });
    this.inFlight = this.send(answer).then(
      ({ savedAt }) => {
        this.failures = 0;
        if (!this.pending) this.setState({ status: 'saved', at: savedAt });
      },
      (error: unknown) => {
        const failure = this.classify(error);
        if (failure.outcome === 'retry') {
          // Keep the newest answer: one typed during the failed send wins over the one that failed.
          this.pending ??= { answer };
          const delays = this.options.retryDelaysMs;
          const wait = delays[Math.min(this.failures, delays.length - 1)] ?? 1000;
          this.failures++;
          this.setState({ status: 'retrying', message: failure.message });
          this.clearTimer();
          if (!this.disposed) this.timer = setTimeout(() => this.run(), wait);
        } else if (failure.outcome === 'closed') {
          this.pending = undefined;
          this.setState({ status: 'closed', message: failure.message });
        } else if (!this.pending) {
          this.setState({ status: 'refused', message: failure.message });
        }
      },
    );
    void this.inFlight.finally(() => {
      this.inFlight = undefined;
      // Something changed while the request was out and its quiet time is over: send it now.
      if (this.pending && this.timer === undefined) this.run();
    });
  }

  private clearTimer(): void {
    if (this.timer !== undefined) clearTimeout(this.timer);
    this.timer = undefined;
  }

  private setState(state: SaveState): void {
    this.current = state;
    this.onState(state);
  }
}
