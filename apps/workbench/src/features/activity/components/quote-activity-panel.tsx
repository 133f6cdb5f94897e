import { useId, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { useQuoteActivity } from '../api/list-activity';
import { ActivityList } from './activity-list';

/** A quote's own history for the owner, opened from the quote page. */
export function QuoteActivityPanel({ quoteId }: { quoteId: string }) {
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const log = useQuoteActivity(quoteId, open);
  return (
    <section aria-label="Quote activity" className="rounded-card bg-surface p-4 shadow-card ring-1 ring-line">
      <div className="flex items-center justify-between gap-4">
        <h2 className="text-lead font-semibold text-ink">Activity</h2>
        <Button variant="secondary" className="h-9 px-3" aria-expanded={open} aria-controls={panelId} onClick={() => setOpen((o) => !o)}>
          {open ? 'Hide' : 'Show who did what'}
        </Button>
      </div>
      <div id={panelId} hidden={!open} className="mt-4">
        {open ? (
          log.isError ? (
            <p role="alert" className="text-caption text-ember-700">
              {log.error.message}
            </p>
          ) : log.data ? (
            <ActivityList
              entries={log.data.pages.flatMap((p) => p.entries)}
              hasMore={log.hasNextPage}
              loadingMore={log.isFetchingNextPage}
              onMore={() => void log.fetchNextPage()}
              linkQuotes={false}
            />
          ) : (
            <p className="text-caption text-ink-muted">Loading…</p>
          )
        ) : null}
      </div>
    </section>
  );
}
