import type { ReactNode } from 'react';

/**
 * What a screen shows before it has anything to list: what will appear here, and what makes it
 * appear. Never placeholder rows.
 */
export function EmptyState({ illustration, title, children }: { illustration: ReactNode; title: string; children: ReactNode }) {
  return (
    <section
      aria-labelledby="empty-state-title"
      className="flex flex-col items-center rounded-card bg-surface px-8 py-14 text-center shadow-card ring-1 ring-line"
    >
      <div className="mb-6">{illustration}</div>
      <h2 id="empty-state-title" className="text-heading font-semibold text-ink">
        {title}
      </h2>
      <div className="mt-3 flex max-w-measure flex-col gap-4 text-body text-ink-muted">{children}</div>
    </section>
  );
}
