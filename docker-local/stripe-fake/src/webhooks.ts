/**
 * Events and their delivery to the webhook endpoint, signed the way Stripe
 * signs them so `stripe.webhooks.constructEvent` accepts them.
 */
import { createHmac } from 'node:crypto';
import { newId } from './ids.ts';
import type { FakeStore } from './store.ts';
import type { DeliveryAttempt, EventLogEntry, EventType, RequestContext, StripeEvent, StripeObject } from './types.ts';

/**
 * Stripe's scheme: `t=<unix seconds>,v1=<hex HMAC-SHA256 of "<t>.<payload>">`,
 * keyed with the whole endpoint secret (including its `whsec_` prefix).
 */
export function signatureHeader(payload: string, secret: string, timestamp: number): string {
  const signature = createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${signature}`;
}

export interface WebhookOptions {
  url: string | undefined;
  secret: string;
  /** Longest wait for one delivery attempt. */
  timeoutMs: number;
  /** Pause before each retry; its length is the number of retries. */
  retryDelaysMs: readonly number[];
  /** Unix seconds on the stand-in's clock, for the event's `created`. */
  clock: () => number;
  log: (line: string) => void;
}

export class WebhookDispatcher {
  private readonly retryTimers = new Map<string, NodeJS.Timeout>();
  private readonly inFlight = new Set<AbortController>();
  private closed = false;

  constructor(
    private readonly store: FakeStore,
    private readonly options: WebhookOptions,
  ) {}

  get endpoint(): string | undefined {
    return this.options.url;
  }

  /**
   * Records the event and makes the first delivery attempt. The returned
   * promise settles after that attempt (bounded by timeoutMs); retries run
   * later in the background, so a payer's redirect is never held up by them.
   */
  async emit(type: EventType, object: StripeObject, context: RequestContext, options: { withhold?: boolean } = {}): Promise<EventLogEntry> {
    const event: StripeEvent = {
      id: newId('evt'),
      object: 'event',
      api_version: context.apiVersion,
      created: this.options.clock(),
      // A snapshot: later changes to the object must not rewrite history.
      data: { object: structuredClone(object) },
      livemode: false,
      pending_webhooks: this.options.url ? 1 : 0,
      request: { id: context.requestId, idempotency_key: context.idempotencyKey },
      type,
    };
    const entry: EventLogEntry = { event, state: options.withhold ? 'withheld' : this.options.url ? 'pending' : 'no_endpoint', attempts: [] };
    this.store.events.set(event.id, entry);
    if (this.options.url && !this.closed && !options.withhold) await this.attempt(entry, false);
    return entry;
  }

  /** Sends a logged event again: same id and body, fresh timestamp and signature. */
  async resend(entry: EventLogEntry): Promise<DeliveryAttempt | null> {
    if (!this.options.url) return null;
    return this.attempt(entry, true);
  }

  /** Stops pending retries (for reset); the dispatcher keeps working afterwards. */
  cancelPending(): void {
    for (const timer of this.retryTimers.values()) clearTimeout(timer);
    this.retryTimers.clear();
    for (const controller of this.inFlight) controller.abort();
    this.inFlight.clear();
  }

  close(): void {
    this.closed = true;
    this.cancelPending();
  }

  private async attempt(entry: EventLogEntry, resend: boolean): Promise<DeliveryAttempt> {
    const url = this.options.url as string;
    const payload = JSON.stringify(entry.event, null, 2);
    const timestamp = Math.floor(Date.now() / 1000);
    const controller = new AbortController();
    this.inFlight.add(controller);
    const timeout = setTimeout(() => controller.abort(), this.options.timeoutMs);
    const startedAt = Date.now();
    const attempt: DeliveryAttempt = {
      attempt: entry.attempts.length + 1,
      at: new Date(startedAt).toISOString(),
      status: null,
      error: null,
      durationMs: 0,
      resend,
    };
    try {
      const response = await fetch(url, {
        method: 'POST',
        headers: {
          'Content-Type': 'application/json; charset=utf-8',
          'Stripe-Signature': signatureHeader(payload, this.options.secret, timestamp),
          'User-Agent': 'scrap-relay-stripe-fake/1.0',
        },
        body: payload,
        signal: controller.signal,
      });
      attempt.status = response.status;
      // Read the body so the connection is released for the next delivery.
      await response.arrayBuffer().catch(() => undefined);
      if (response.status < 200 || response.status >= 300) attempt.error = `HTTP ${response.status}`;
    } catch (error) {
      attempt.error = controller.signal.aborted ? `no answer within ${this.options.timeoutMs} ms` : describe(error);
    } finally {
      clearTimeout(timeout);
      this.inFlight.delete(controller);
      attempt.durationMs = Date.now() - startedAt;
    }
    entry.attempts.push(attempt);
    this.afterAttempt(entry, attempt);
    return attempt;
  }

  private afterAttempt(entry: EventLogEntry, attempt: DeliveryAttempt): void {
    const id = entry.event.id;
    if (attempt.error === null) {
      entry.state = 'delivered';
      const timer = this.retryTimers.get(id);
      if (timer) clearTimeout(timer);
      this.retryTimers.delete(id);
      return;
    }
    this.options.log(`webhook ${entry.event.type} ${id} attempt ${attempt.attempt} failed: ${attempt.error}`);
    // A failed resend of an already delivered event does not reopen it.
    if (entry.state === 'delivered' || this.retryTimers.has(id)) return;
    const automaticAttempts = entry.attempts.filter((a) => !a.resend).length;
    const delay = attempt.resend ? undefined : this.options.retryDelaysMs[automaticAttempts - 1];
    if (delay === undefined || this.closed) {
      if (!attempt.resend) entry.state = 'failed';
      return;
    }
    entry.state = 'pending';
    const timer = setTimeout(() => {
      this.retryTimers.delete(id);
      if (this.store.events.get(id) !== entry) return;
      void this.attempt(entry, false);
    }, delay);
    timer.unref();
    this.retryTimers.set(id, timer);
  }
}

function describe(error: unknown): string {
  if (error instanceof Error) {
    const cause = (error as Error & { cause?: unknown }).cause;
    if (cause instanceof Error) return `${error.message}: ${cause.message}`;
    return error.message;
  }
  return String(error);
}
