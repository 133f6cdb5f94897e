import type { ReactNode } from 'react';

export function PageHeader({ eyebrow, title, children }: { eyebrow?: string; title: string; children?: ReactNode }) {
  return (
    <header className="mb-8 flex flex-col gap-2">
      {eyebrow ? <p className="text-caption font-semibold tracking-wide text-lamp-700 uppercase">{eyebrow}</p> : null}
      <h1 className="text-title font-semibold tracking-tight text-ink">{title}</h1>
      {children ? <div className="max-w-measure text-body text-ink-muted">{children}</div> : null}
    </header>
  );
}
