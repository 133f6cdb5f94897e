import type { EstimateContent, RevisionTotals } from '@gloaming/contracts';
import { useCallback, useEffect, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { ApiError } from '../../../lib/api-error';
import { fetchQuote } from '../api/get-quote';
import { quoteKeys } from '../api/quote-keys';
import { saveRevision } from '../api/save-revision';

export type SaveState =
  | { kind: 'saved'; at: Date | null }
  | { kind: 'pending' }
  | { kind: 'saving' }
  | { kind: 'conflict'; detail: string }
  | { kind: 'error'; detail: string };

export const AUTOSAVE_DELAY_MS = 900;

/** Whether the server now has the edits that were asked to be saved, and if not, why. */
export type SaveOutcome = { ok: true } | { ok: false; detail: string };

/**
 * Debounced autosave of the whole estimate with optimistic locking. A 409 stops saving and
 * asks the estimator: reload theirs (handed to `onReload`) or keep mine (saved over theirs on
 * the version the server now has). Nothing is dropped: until one is chosen, the edits stay.
 */
export function useAutosave(options: {
  quoteId: string;
  revisionNumber: number;
  initialVersion: number;
  content: EstimateContent;
  enabled: boolean;
  onSaved: (totals: RevisionTotals) => void;
  onReload: (content: EstimateContent, version: number) => void;
}) {
  const { quoteId, revisionNumber, content, enabled } = options;
  const queryClient = useQueryClient();
  const version = useRef(options.initialVersion);
  const saved = useRef<EstimateContent>(content);
  const inFlight = useRef(false);
  const latest = useRef(content);
  const callbacks = useRef(options);
  useEffect(() => {
    latest.current = content;
    callbacks.current = options;
  });
  const [state, setState] = useState<SaveState>({ kind: 'saved', at: null });
  /** Bumped when a save finishes, so edits made meanwhile are scheduled next. */
  const [finished, setFinished] = useState(0);
  const blocked = state.kind === 'conflict';

  /** The save on the wire, if any: a second caller waits for it instead of starting another. */
  const current = useRef<Promise<SaveOutcome> | null>(null);

  const saveOnce = useCallback(async (): Promise<SaveOutcome> => {
    const sending = latest.current;
    if (sending === saved.current) return { ok: true };
    inFlight.current = true;
    setState({ kind: 'saving' });
    try {
      const res = await saveRevision(quoteId, revisionNumber, { version: version.current, content: sending });
      version.current = res.revision.version;
      saved.current = sending;
      callbacks.current.onSaved(res.revision.totals);
      void queryClient.invalidateQueries({ queryKey: quoteKeys.lists() });
      setState(latest.current === sending ? { kind: 'saved', at: new Date() } : { kind: 'pending' });
      return { ok: true };
    } catch (err) {
      const detail = err instanceof ApiError ? err.detail : 'The estimate could not be saved.';
      setState(err instanceof ApiError && err.status === 409 ? { kind: 'conflict', detail } : { kind: 'error', detail });
      return { ok: false, detail };
    } finally {
      inFlight.current = false;
      setFinished((n) => n + 1);
    }
  }, [queryClient, quoteId, revisionNumber]);

  /** One save of the latest content, or the one already on the wire. */
  const save = useCallback((): Promise<SaveOutcome> => {
    if (current.current) return current.current;
    const p = saveOnce().finally(() => {
      current.current = null;
    });
    current.current = p;
    return p;
  }, [saveOnce]);

  /**
   * Save until the server has the latest edits: waits for a save already on the wire (its
   * outcome alone says nothing about edits made meanwhile), then saves what is newer. Resolves
   * `ok: false` with the reason when the latest edits could not be saved.
   */
  const saveAll = useCallback(async (): Promise<SaveOutcome> => {
    for (let attempt = 0; attempt < 5; attempt++) {
      if (current.current) {
        await current.current;
        continue;
      }
      if (latest.current === saved.current) return { ok: true };
      const outcome = await save();
      if (!outcome.ok) return outcome;
    }
    return latest.current === saved.current
      ? { ok: true }
      : { ok: false, detail: 'The estimate keeps changing while it saves; wait a moment and try again.' };
  }, [save]);

  useEffect(() => {
    if (!enabled || blocked || inFlight.current || content === saved.current) return;
    setState((s) => (s.kind === 'error' ? s : { kind: 'pending' }));
    const timer = window.setTimeout(() => void save(), AUTOSAVE_DELAY_MS);
    return () => window.clearTimeout(timer);
  }, [content, enabled, blocked, save, finished]);

  useEffect(() => {
    const warn = (e: BeforeUnloadEvent) => {
      if (latest.current !== saved.current) e.preventDefault();
    };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, []);

  const reloadTheirs = useCallback(async () => {
    const detail = await fetchQuote(quoteId);
    queryClient.setQueryData(quoteKeys.detail(quoteId), detail);
    version.current = detail.revision.version;
    saved.current = detail.revision.content;
    callbacks.current.onReload(detail.revision.content, detail.revision.version);
    setState({ kind: 'saved', at: new Date() });
  }, [queryClient, quoteId]);

  const keepMine = useCallback(async () => {
    const detail = await fetchQuote(quoteId);
    version.current = detail.revision.version;
    saved.current = detail.revision.content; // so "mine" differs and is sent
    setState({ kind: 'pending' });
    await save();
  }, [quoteId, save]);

  return { state, reloadTheirs, keepMine, saveNow: saveAll };
}
