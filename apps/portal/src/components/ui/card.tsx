import type { ReactNode } from 'react';

/** A titled block of the page; the heading names the region for screen readers. */
export function Card({
  id,
  title,
  children,
  className = '',
}: {
  id: string;
  title: string;
  children: ReactNode;
  className?: string;
}) {
  return (
    <section
      aria-labelledby={`${id}-title`}
      className={`rounded-card bg-surface p-4 shadow-card ring-1 ring-line sm:p-6 ${className}`}
    >
      <h2 id={`${id}-title`} className="text-heading font-semibold tracking-tight">
        {title}
      </h2>
      <div className="mt-3">{children}</div>
    </section>
  );
}
