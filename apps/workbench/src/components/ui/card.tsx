import type { ReactNode } from 'react';

export function Card({
  title,
  description,
  actions,
  children,
  headingLevel = 2,
  className = '',
}: {
  title?: string;
  description?: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
  headingLevel?: 2 | 3;
  className?: string;
}) {
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <section className={`rounded-card bg-surface shadow-card ring-1 ring-line ${className}`}>
      {title ? (
        <header className="flex items-start justify-between gap-4 border-b border-line px-6 py-5">
          <div className="flex flex-col gap-1">
            <Heading className="text-lead font-semibold text-ink">{title}</Heading>
            {description ? <p className="text-caption text-ink-muted">{description}</p> : null}
          </div>
          {actions}
        </header>
      ) : null}
      <div className="px-6 py-5">{children}</div>
    </section>
  );
}
