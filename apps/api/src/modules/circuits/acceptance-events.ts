/**
 * Accepting a circuit's error with a reason (or taking that back) is part of the quote's
 * history: each change of a design's acknowledgements between two saves becomes a
 * `finding-accepted` or `finding-withdrawn` event naming the circuit, the finding's code and
 * subject, the reason and who did it. These events do not move the quote's status.
 */
import type { Acknowledgement, CircuitDesign, FindingAcceptanceEventData } from '@gloaming/contracts';
import type { EntityManager, Quote, QuoteRevision } from '@gloaming/db';
import { appendQuoteEvent, type Actor } from '../quotes/service';

const keyOf = (a: Pick<Acknowledgement, 'code' | 'subject'>) => `${a.code}\u0000${a.subject ?? ''}`;

export interface AcceptanceChange {
  type: 'finding-accepted' | 'finding-withdrawn';
  ack: Acknowledgement;
}

/** What changed between two lists of acknowledgements; a changed reason is a withdrawal and a new acceptance. */
export function acceptanceChanges(before: readonly Acknowledgement[], after: readonly Acknowledgement[]): AcceptanceChange[] {
  const was = new Map(before.map((a) => [keyOf(a), a]));
  const now = new Map(after.map((a) => [keyOf(a), a]));
  const changes: AcceptanceChange[] = [];
  for (const [key, a] of was) {
    const b = now.get(key);
    if (!b || b.reason !== a.reason) changes.push({ type: 'finding-withdrawn', ack: a });
  }
  for (const [key, b] of now) {
    const a = was.get(key);
    if (!a || a.reason !== b.reason) changes.push({ type: 'finding-accepted', ack: b });
  }
  return changes;
}

/** Append an event per change. Persisted, not flushed: the caller flushes with the circuit. */
export function recordAcceptances(
  em: EntityManager,
  quote: Quote,
  revision: QuoteRevision,
  circuit: { id: string; name: string; area: string },
  before: CircuitDesign | null,
  after: CircuitDesign,
  actor: Actor,
): number {
  const changes = acceptanceChanges(before?.acknowledgements ?? [], after.acknowledgements);
  for (const { type, ack } of changes) {
    const data: FindingAcceptanceEventData = {
      circuitId: circuit.id,
      circuitName: circuit.name,
      area: circuit.area,
      code: ack.code,
      subject: ack.subject,
      reason: ack.reason,
    };
    appendQuoteEvent(em, quote, type, actor, { revisionNumber: revision.number, ...data }, revision);
  }
  return changes.length;
}
