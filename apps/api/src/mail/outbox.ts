import type { EventSubscriber, FlushEventArgs, TransactionEventArgs } from '@mikro-orm/core';
import { newId, Organization, OutboxMessage, type Database, type EntityManager, type OutboxState } from '@gloaming/db';
import type { Logger } from '../app-deps';
import type { MailTransport, OutgoingMail } from './mailer';

/** What a caller tells the person about one e-mail: out of our hands, waiting to be retried, or given up. */
export type MailDelivery = 'sent' | 'queued' | 'failed';

export interface QueueOptions {
  /**
   * The unit of work of the change that causes this mail: the row is persisted into it and
   * written by that flush or commit, so the mail exists exactly when the change does. Without
   * it the row is written at once on its own.
   */
  em?: EntityManager;
  /** What kind of mail (quote, reply, invite...), for logs and support. */
  kind?: string;
  /** What the mail announces (a portal link's id): screens look the delivery up by it. */
  reference?: string;
  organizationId?: string;
}

export interface QueuedMail {
  id: string;
}

export interface OutboxPolicy {
  /** Delay before the first retry; each further retry waits twice as long. */
  retryBaseMs: number;
  /** Longest wait between two attempts. */
  retryMaxMs: number;
  /** Hand-overs before a message is marked failed. */
  maxAttempts: number;
  /** How long a hand-over may take before another process may try the message again. */
  leaseMs: number;
}

export const DEFAULT_OUTBOX_POLICY: OutboxPolicy = {
  retryBaseMs: 30_000,
  retryMaxMs: 3_600_000,
  maxAttempts: 8,
  leaseMs: 5 * 60_000,
};

/** One round of the delivery worker. */
export interface DeliveryRound {
  sent: number;
  retrying: number;
  failed: number;
}

/**
 * The api's only way to send e-mail. `send` stores the message in the outbox table; once the
 * row is committed one hand-over to the mail server starts at once. Failures are retried with
 * exponential back-off by `deliverDue` (the worker in main.ts runs it on a timer; createApp
 * starts no timer), then marked failed. Each hand-over first claims its row with a conditional
 * update, so two rounds or two processes never send the same pending row twice.
 */
export interface Outbox {
  send(mail: OutgoingMail, options?: QueueOptions): Promise<QueuedMail>;
  /**
   * How the message stands: waits up to `waitMs` for a hand-over in progress here to finish
   * (so a caller can say "sent" when the mail server answered quickly, "queued" otherwise).
   */
  outcome(id: string, waitMs?: number): Promise<MailDelivery>;
  /** Hand over every due message (new, due for a retry, or left mid-send by a dead process). */
  deliverDue(now?: Date): Promise<DeliveryRound>;
  /** Resolves once no hand-over is running (before the database closes). */
  idle(): Promise<void>;
}

/** `sending` is still ours to finish: to the person it is queued until the server took it. */
export function deliveryOf(state: OutboxState): MailDelivery {
  return state === 'sent' ? 'sent' : state === 'failed' ? 'failed' : 'queued';
}

/** Wait before the retry that follows attempt `attempts` (1-based): base·2^(n−1), capped. */
export function retryDelayMs(policy: OutboxPolicy, attempts: number): number {
  return Math.min(policy.retryMaxMs, policy.retryBaseMs * 2 ** Math.max(0, attempts - 1));
}

const toRow = (m: Pick<OutboxMessage, 'id' | 'status' | 'attempts'>) => ({ id: m.id, status: m.status, attempts: m.attempts });

export function createOutbox(p: {
  orm: Database;
  transport: MailTransport;
  logger: Pick<Logger, 'error'>;
  policy?: Partial<OutboxPolicy>;
}): Outbox {
  const policy: OutboxPolicy = { ...DEFAULT_OUTBOX_POLICY, ...p.policy };
  const inflight = new Map<string, Promise<OutboxState>>();
  /** Rows created in an entity manager whose transaction has not committed yet. */
  const uncommitted = new WeakMap<EntityManager, string[]>();

  async function handOver(row: { id: string; status: OutboxState; attempts: number }): Promise<OutboxState> {
    const em = p.orm.em.fork();
    const started = new Date();
    const attempts = row.attempts + 1;
    const claimed = await em.nativeUpdate(
      OutboxMessage,
      { id: row.id, status: row.status, attempts: row.attempts },
      { status: 'sending', attempts, nextAttemptAt: new Date(started.getTime() + policy.leaseMs) },
    );
    if (claimed !== 1) {
      const now = await em.findOne(OutboxMessage, row.id);
      return now?.status ?? 'failed';
    }
    const message = await em.findOneOrFail(OutboxMessage, row.id);
    try {
      await p.transport.send({
        to: message.to,
        ...(message.fromName ? { fromName: message.fromName } : {}),
        subject: message.subject,
        text: message.text,
        ...(message.html ? { html: message.html } : {}),
        ...(message.attachments.length
          ? {
              attachments: message.attachments.map((a) => ({
                filename: a.filename,
                contentType: a.contentType,
                content: Buffer.from(a.contentBase64, 'base64'),
              })),
            }
          : {}),
      });
    } catch (err) {
      const reason = err instanceof Error ? err.message : String(err);
      const giveUp = attempts >= policy.maxAttempts;
      await em.nativeUpdate(
        OutboxMessage,
        { id: row.id, attempts },
        giveUp
          ? { status: 'failed', lastError: reason.slice(0, 2000) }
          : {
              status: 'pending',
              lastError: reason.slice(0, 2000),
              nextAttemptAt: new Date(Date.now() + retryDelayMs(policy, attempts)),
            },
      );
      if (giveUp) p.logger.error(`E-mail ${row.id} ("${message.subject}") to ${message.to} failed after ${attempts} attempts; given up`, err);
      return giveUp ? 'failed' : 'pending';
    }
    await em.nativeUpdate(OutboxMessage, { id: row.id, attempts }, { status: 'sent', sentAt: new Date(), lastError: null });
    return 'sent';
  }

  function start(row: { id: string; status: OutboxState; attempts: number }): Promise<OutboxState> {
    const running = inflight.get(row.id);
    if (running) return running;
    const attempt = handOver(row)
      .catch((err: unknown) => {
        p.logger.error(`E-mail ${row.id}: the outbox could not record a hand-over`, err);
        return row.status;
      })
      .finally(() => inflight.delete(row.id));
    inflight.set(row.id, attempt);
    return attempt;
  }

  /** The first hand-over of freshly committed rows, started before the commit returns to its caller. */
  async function startCommitted(ids: string[]): Promise<void> {
    if (ids.length === 0) return;
    const rows = await p.orm.em.fork().find(OutboxMessage, { id: { $in: ids }, status: 'pending' });
    for (const r of rows) void start(toRow(r));
  }

  const subscriber: EventSubscriber = {
    afterCreate(args) {
      if (!(args.entity instanceof Object) || args.meta.className !== 'OutboxMessage') return;
      const list = uncommitted.get(args.em) ?? [];
      list.push((args.entity as OutboxMessage).id);
      uncommitted.set(args.em, list);
    },
    async afterFlush(args: FlushEventArgs) {
      if (args.em.isInTransaction()) return; // the commit starts them
      const ids = uncommitted.get(args.em);
      uncommitted.delete(args.em);
      if (ids) await startCommitted(ids);
    },
    async afterTransactionCommit(args: TransactionEventArgs) {
      const ids = uncommitted.get(args.em);
      uncommitted.delete(args.em);
      if (ids) await startCommitted(ids);
    },
    afterTransactionRollback(args: TransactionEventArgs) {
      uncommitted.delete(args.em);
    },
  };
  p.orm.em.getEventManager().registerSubscriber(subscriber);

  return {
    async send(mail, options = {}) {
      const own = !options.em;
      const em = options.em ?? p.orm.em.fork();
      const row = em.create(OutboxMessage, {
        id: newId(), // known before the flush: the caller answers with it
        organization: options.organizationId ? em.getReference(Organization, options.organizationId) : null,
        kind: options.kind ?? 'mail',
        reference: options.reference ?? null,
        to: mail.to,
        fromName: mail.fromName ?? null,
        subject: mail.subject,
        text: mail.text,
        html: mail.html ?? null,
        attachments: (mail.attachments ?? []).map((a) => ({
          filename: a.filename,
          contentType: a.contentType,
          contentBase64: a.content.toString('base64'),
        })),
        status: 'pending',
        attempts: 0,
        nextAttemptAt: new Date(),
        lastError: null,
        sentAt: null,
      });
      if (own) await em.flush();
      return { id: row.id };
    },

    async outcome(id, waitMs = 0) {
      const running = inflight.get(id);
      if (running && waitMs > 0) {
        let timer: NodeJS.Timeout | undefined;
        const state = await Promise.race([
          running,
          new Promise<'sending'>((r) => {
            timer = setTimeout(() => r('sending'), waitMs);
          }),
        ]);
        clearTimeout(timer);
        return deliveryOf(state);
      }
      const row = await p.orm.em.fork().findOne(OutboxMessage, id);
      return row ? deliveryOf(row.status) : 'failed';
    },

    async deliverDue(now = new Date()) {
      const due = await p.orm.em.fork().find(
        OutboxMessage,
        { status: { $in: ['pending', 'sending'] }, nextAttemptAt: { $lte: now } },
        { orderBy: { nextAttemptAt: 'asc' }, limit: 50, fields: ['id', 'status', 'attempts'] },
      );
      const results = await Promise.all(due.map((r) => start(toRow(r))));
      return {
        sent: results.filter((s) => s === 'sent').length,
        retrying: results.filter((s) => s === 'pending' || s === 'sending').length,
        failed: results.filter((s) => s === 'failed').length,
      };
    },

    async idle() {
      while (inflight.size > 0) await Promise.allSettled([...inflight.values()]);
    },
  };
}

/**
 * The delivery worker: a round at once (pending messages left by a restart go out now), then
 * one every `everyMs`. Returns a stop function that waits for running hand-overs.
 */
export function startOutboxWorker(outbox: Outbox, logger: Pick<Logger, 'error'>, everyMs = 5_000): () => Promise<void> {
  let round: Promise<unknown> = Promise.resolve();
  let running = false;
  const run = () => {
    if (running) return;
    running = true;
    round = outbox
      .deliverDue()
      .catch((err: unknown) => logger.error('The e-mail outbox round failed; it runs again shortly', err))
      .finally(() => {
        running = false;
      });
  };
  run();
  const timer = setInterval(run, everyMs);
  timer.unref();
  return async () => {
    clearInterval(timer);
    await round;
    await outbox.idle();
  };
}
