import type { ProviderEvent } from './objects';
import { signatureHeader } from './signature';

/** One delivery attempt of one event, as kept in the delivery log. */
export type DeliveryLogEntry = {
  eventId: string;
  type: string;
  /** 1 for the first try. */
  attempt: number;
  /** ISO time of the attempt. */
  at: string;
  /** True on the last failed attempt, after which the event is not sent again. */
  gaveUp: boolean;
} & ({ status: number; error?: undefined } | { error: string; status?: undefined });

export interface WebhookDeliveryOptions {
  secret: string;
  /** Waits between attempts; one attempt more than there are delays. */
  retryDelaysMs: readonly number[];
  url: () => string | undefined;
  log: (line: string) => void;
  timeoutMs?: number;
}

/**
 * Sends every event as JSON to the webhook URL, signed the provider's way, retrying a non-2xx
 * answer or a network error after each delay in turn and then giving up. Events of one
 * checkout session go out one after another in the order they were created; different
 * sessions do not wait for each other.
 */
export class WebhookDelivery {
  private readonly log: DeliveryLogEntry[] = [];
  private readonly chains = new Map<string, Promise<void>>();
  private readonly pending = new Set<Promise<void>>();
  private readonly sleepers = new Set<() => void>();
  private readonly controllers = new Set<AbortController>();
  private closed = false;

  constructor(private readonly options: WebhookDeliveryOptions) {}

  enqueue(event: ProviderEvent, orderingKey: string): void {
    if (this.closed || !this.options.url()) return;
    // Pretty-printed like the provider's: a receiver that re-serialises before verifying fails.
    const payload = JSON.stringify(event, null, 2);
    const previous = this.chains.get(orderingKey) ?? Promise.resolve();
    const next = previous.then(() => this.deliver(event, payload));
    this.chains.set(orderingKey, next);
    this.pending.add(next);
    void next.finally(() => {
      this.pending.delete(next);
      if (this.chains.get(orderingKey) === next) this.chains.delete(orderingKey);
    });
  }

  entries(): readonly DeliveryLogEntry[] {
    return [...this.log];
  }

  async idle(): Promise<void> {
    while (this.pending.size > 0) await Promise.all([...this.pending]);
  }

  close(): void {
    this.closed = true;
    for (const wake of this.sleepers) wake();
    for (const c of this.controllers) c.abort();
  }

  private async deliver(event: ProviderEvent, payload: string): Promise<void> {
    const delays = this.options.retryDelaysMs;
    for (let attempt = 1; attempt <= delays.length + 1 && !this.closed; attempt++) {
      const url = this.options.url();
      if (!url) return;
      const last = attempt === delays.length + 1;
      const at = new Date().toISOString();
      const controller = new AbortController();
      this.controllers.add(controller);
      const timer = setTimeout(() => controller.abort(), this.options.timeoutMs ?? 10_000);
      let ok = false;
      try {
        // Signed with the wall clock at each attempt, as the receiver checks its tolerance against it.
        const res = await fetch(url, {
          method: 'POST',
          headers: {
            'content-type': 'application/json; charset=utf-8',
            'user-agent': 'Gloaming-Payment-Fake/1.0 (webhooks)',
            'stripe-signature': signatureHeader(payload, this.options.secret, Math.floor(Date.now() / 1000)),
          },
          body: payload,
          signal: controller.signal,
        });
        await res.arrayBuffer().catch(() => undefined);
        ok = res.status >= 200 && res.status < 300;
        this.log.push({ eventId: event.id, type: event.type, attempt, at, status: res.status, gaveUp: !ok && last });
      } catch (err) {
        const error = this.closed
          ? 'fake closed'
          : err instanceof Error
            ? err.cause instanceof Error
              ? err.cause.message
              : err.message
            : String(err);
        this.log.push({ eventId: event.id, type: event.type, attempt, at, error, gaveUp: last });
      } finally {
        clearTimeout(timer);
        this.controllers.delete(controller);
      }
      if (ok) return;
      if (last) {
        this.options.log(`payment fake: gave up delivering ${event.type} ${event.id} to ${url} after ${attempt} attempts`);
        return;
      }
      await this.sleep(delays[attempt - 1] ?? 0);
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
