/** What index.html shows before the page's code has run (and the quote page while its GET is on its way). */
export const SHELL_STATUS = 'Loading…';

/** The dark band at the top of a page that has no quote to name (the shell, a link problem). */
export function PlainBand() {
  return (
    <header className="on-dark bg-dusk-950">
      <div className="mx-auto max-w-2xl px-4 py-4 sm:px-6">
        <span className="text-lead font-semibold text-white">Your lighting quote</span>
      </div>
    </header>
  );
}

/**
 * The portal's bare frame: the dark band and a status line. index.html carries the same markup
 * inside #root (test/page-shell.test.tsx keeps the two equal), so a phone paints it as soon as
 * the HTML and CSS arrive; React replaces it when it mounts.
 */
export function PageShell({ status }: { status: string }) {
  return (
    <div className="min-h-screen bg-canvas text-ink">
      <PlainBand />
      <main className="mx-auto max-w-2xl px-4 py-6 sm:px-6">
        <p role="status" className="text-ink-muted">
          {status}
        </p>
      </main>
    </div>
  );
}
