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

  const save = useCallback(async () => {
    if (inFlight.current) return;
    const sending = latest.current;
    if (sending === saved.current) return;
    inFlight.current = true;
    setState({ kind: 'saving' });
    try {
      const res = await saveRevision(quoteId, revisionNumber, { version: version.current, content: sending });
      version.current = res.revision.version;
      saved.current = sending;
      callbacks.current.onSaved(res.revision.totals);
      void queryClient.invalidateQueries({ queryKey: quoteKeys.lists() });
      setState(latest.current === sending ? { kind: 'saved', at: new Date() } : { kind: 'pending' });
    } catch (err) {
      if (err instanceof ApiError && err.status === 409) setState({ kind: 'conflict', detail: err.detail });
      else setState({ kind: 'error', detail: err instanceof ApiError ? err.detail : 'The estimate could not be saved.' });
    } finally {
      inFlight.current = false;
      setFinished((n) => n + 1);
    }
  }, [queryClient, quoteId, revisionNumber]);

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

  return { state, reloadTheirs, keepMine, saveNow: save };
}
