import { QueryClientProvider } from '@tanstack/react-query';
import { act, cleanup, renderHook } from '@testing-library/react';
import type { ReactNode } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { EstimateContent, SaveRevisionResponse } from '@gloaming/contracts';
import { useAutosave, type SaveOutcome } from '../../src/features/quotes/hooks/use-autosave';
import { createQueryClient } from '../../src/lib/query-client';
import { json, problem, stubFetch, type SentRequest } from '../fetch-stub';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const doc = (name: string): EstimateContent => ({
  sections: [{ id: 's1', name, lines: [] }],
  discount: null,
  deposit: null,
  introduction: '',
});
const when = '2026-12-01T10:00:00.000Z';
const saved = (version: number): SaveRevisionResponse => ({
  revision: {
    id: 'rev-1',
    number: 1,
    version,
    updatedAt: when,
    totals: {
      grossMinor: 0,
      lineDiscountMinor: 0,
      quoteDiscountMinor: 0,
      netMinor: 0,
      vatByRate: [],
      vatMinor: 0,
      totalMinor: 0,
      costMinor: 0,
      grossMarginMinor: 0,
      grossMarginBp: null,
      deposit: null,
      findings: [],
    },
  },
  quote: {
    id: 'q-1',
    number: 1,
    reference: 'Q-0001',
    title: '',
    customer: { id: 'c-1', name: 'Ottilie Brackenbury' },
    site: null,
    estimator: { id: 'u-1', name: 'Maren Holloway' },
    status: 'draft',
    valueMinor: 0,
    currency: 'GBP',
    createdAt: when,
    updatedAt: when,
    sentAt: null,
    validUntil: null,
  },
});

/** A fetch whose answers the test releases one at a time, to hold a save on the wire. */
function heldFetch() {
  const waiting: { request: SentRequest; release: (r: Response) => void }[] = [];
  const { sent } = stubFetch(
    (request) =>
      new Promise<Response>((release) => {
        waiting.push({ request, release });
      }),
  );
  return { sent, waiting };
}

function renderAutosave(content: EstimateContent) {
  const client = createQueryClient();
  const wrapper = ({ children }: { children: ReactNode }) => (
    <QueryClientProvider client={client}>{children}</QueryClientProvider>
  );
  return renderHook(
    (props: { content: EstimateContent }) =>
      useAutosave({
        quoteId: 'q-1',
        revisionNumber: 1,
        initialVersion: 3,
        content: props.content,
        enabled: true,
        onSaved: () => undefined,
        onReload: () => undefined,
      }),
    { wrapper, initialProps: { content } },
  );
}

describe('useAutosave: save before sending', () => {
  it('waits for the save on the wire, then saves the edits made meanwhile, and only then reports ok', async () => {
    const { sent, waiting } = heldFetch();
    const hook = renderAutosave(doc('Front'));
    hook.rerender({ content: doc('Front garden') });
    let first!: Promise<SaveOutcome>;
    act(() => {
      first = hook.result.current.saveNow(); // a save goes on the wire with "Front garden"
    });
    await vi.waitFor(() => expect(waiting).toHaveLength(1));
    hook.rerender({ content: doc('Front garden and path') }); // typed while it saves
    let outcome: SaveOutcome | null = null;
    const before = hook.result.current.saveNow().then((o) => (outcome = o));
    await act(async () => waiting[0]!.release(json(200, saved(4))));
    await vi.waitFor(() => expect(waiting).toHaveLength(2));
    expect(outcome).toBeNull(); // not done: the newer edits are not on the server yet
    expect(sent[1]!.body).toEqual({ version: 4, content: doc('Front garden and path') });
    await act(async () => waiting[1]!.release(json(200, saved(5))));
    await before;
    expect(outcome).toEqual({ ok: true });
    expect(await first).toEqual({ ok: true });
    expect(sent).toHaveLength(2);
  });

  it('reports the reason when the save in flight fails, so the send can be refused', async () => {
    const { waiting } = heldFetch();
    const hook = renderAutosave(doc('Front'));
    hook.rerender({ content: doc('Front garden') });
    act(() => {
      void hook.result.current.saveNow();
    });
    await vi.waitFor(() => expect(waiting).toHaveLength(1));
    const before = hook.result.current.saveNow();
    await act(async () =>
      waiting[0]!.release(problem(409, { title: 'Conflict', detail: 'Someone else saved this quote after you opened it.' })),
    );
    // the retry after the failed save meets the same answer
    await vi.waitFor(() => expect(waiting).toHaveLength(2));
    await act(async () =>
      waiting[1]!.release(problem(409, { title: 'Conflict', detail: 'Someone else saved this quote after you opened it.' })),
    );
    expect(await before).toEqual({ ok: false, detail: 'Someone else saved this quote after you opened it.' });
    expect(hook.result.current.state.kind).toBe('conflict');
  });

  it('answers ok at once when nothing is unsaved', async () => {
    const { sent } = heldFetch();
    const hook = renderAutosave(doc('Front'));
    expect(await hook.result.current.saveNow()).toEqual({ ok: true });
    expect(sent).toHaveLength(0);
  });
});
