const STEPS = [
  {
    title: 'Review your quote',
    text: 'See each light, where it goes in your garden and what it costs, with VAT shown, exactly as your firm prepared it.',
  },
  {
    title: 'Choose your options',
    text: 'Where your firm offers choices, such as a different finish or extra lights along a path, pick the ones you want and watch the total follow.',
  },
  {
    title: 'Approve it',
    text: 'When you are happy, approve the quote. Your firm is told straight away and the price you approved is kept on record.',
  },
  {
    title: 'Pay the deposit',
    text: 'Pay the deposit by card through a secure payment page to book the installation. The balance is settled with your firm as its terms say.',
  },
] as const;

export function LandingPage() {
  return (
    <div className="min-h-screen bg-canvas text-ink">
      <a
        href="#main"
        className="sr-only z-50 rounded-control bg-accent px-4 py-2 font-semibold text-accent-ink focus:not-sr-only focus:fixed focus:px-4 focus:py-2 focus:top-3 focus:left-3"
      >
        Skip to main content
      </a>
      <header className="on-dark bg-dusk-950">
        <div className="mx-auto flex max-w-5xl items-center justify-between px-5 py-4 sm:px-8">
          <span className="flex items-center gap-2.5">
            <Mark />
            <span className="text-lead font-semibold tracking-tight text-white">Gloaming</span>
          </span>
          <span className="rounded-pill bg-dusk-800 px-3 py-1 text-caption font-semibold text-dusk-100 ring-1 ring-dusk-700">
            Homeowner portal
          </span>
        </div>
      </header>

      <main id="main">
        <section
          aria-labelledby="intro-title"
          className="on-dark relative overflow-hidden bg-dusk-900 bg-[radial-gradient(ellipse_at_85%_120%,rgb(245_168_58/0.3),transparent_55%)]"
        >
          <Glow />
          <div className="relative mx-auto max-w-5xl px-5 pt-12 pb-28 sm:px-8 sm:pt-20 sm:pb-28">
            <p className="text-caption font-semibold tracking-wide text-lamp-300 uppercase">For homeowners</p>
            <h1 id="intro-title" className="mt-3 max-w-2xl text-title font-semibold tracking-tight text-white sm:text-display">
              Your garden lighting quote arrives as a personal link
            </h1>
            <p className="mt-5 max-w-xl text-lead text-dusk-100">
              The lighting firm that surveyed your garden sends you an e-mail with a link made for you. Open it on your phone or
              computer to see the quote. There is no account to create and no password to remember.
            </p>
          </div>
        </section>

        <section aria-labelledby="steps-title" className="mx-auto max-w-5xl px-5 py-12 sm:px-8 sm:py-16">
          <h2 id="steps-title" className="text-heading font-semibold tracking-tight">
            What you can do with your link
          </h2>
          <ol className="mt-6 grid gap-4 sm:grid-cols-2">
            {STEPS.map((step, index) => (
              <li key={step.title} className="flex gap-4 rounded-card bg-surface p-5 shadow-card ring-1 ring-line">
                <span
                  aria-hidden="true"
                  className="flex size-9 shrink-0 items-center justify-center rounded-pill bg-lamp-100 font-semibold text-lamp-800"
                >
                  {index + 1}
                </span>
                <div>
                  <h3 className="font-semibold text-ink">{step.title}</h3>
                  <p className="mt-1 text-ink-muted">{step.text}</p>
                </div>
              </li>
            ))}
          </ol>
        </section>

        <section aria-labelledby="lost-title" className="mx-auto max-w-5xl px-5 pb-12 sm:px-8 sm:pb-16">
          <div className="rounded-card bg-dusk-50 p-6 ring-1 ring-dusk-200 sm:p-8">
            <h2 id="lost-title" className="text-heading font-semibold tracking-tight">
              Lost your link, or it no longer opens?
            </h2>
            <div className="mt-3 flex max-w-measure flex-col gap-3 text-ink-muted">
              <p>
                Contact the lighting firm that sent your quote and ask them to send the link again. Their name and contact details
                are in the e-mail the link came in.
              </p>
              <p>
                To keep your details private, quotes cannot be looked up from this page. Your link is personal to you, so please
                do not forward it to anyone you would not want to approve the quote.
              </p>
            </div>
          </div>
        </section>
      </main>

      <footer className="border-t border-line">
        <div className="mx-auto flex max-w-5xl flex-col gap-2 px-5 py-6 text-caption text-ink-muted sm:flex-row sm:items-center sm:justify-between sm:px-8">
          <p>Gloaming, for firms that design and install outdoor low-voltage lighting.</p>
          <p>
            Work for a lighting firm?{' '}
            <a href="/" className="font-semibold text-dusk-600 underline underline-offset-4">
              Sign in to the workbench
            </a>
          </p>
        </div>
      </footer>
    </div>
  );
}

function Mark() {
  return (
    <svg viewBox="0 0 32 32" className="size-8" aria-hidden="true">
      <rect width="32" height="32" rx="9" fill="#1b2552" />
      <circle cx="16" cy="14" r="11" fill="#ffc266" opacity="0.2" />
      <path d="M9 24.5h14" stroke="#7182c8" strokeWidth="1.75" strokeLinecap="round" />
      <path d="M16 24.5v-7" stroke="#c7cff0" strokeWidth="2" strokeLinecap="round" />
      <path d="M12.5 15.5h7l-1.2-3.2a1 1 0 0 0-.94-.65h-2.72a1 1 0 0 0-.94.65z" fill="#ffc266" />
    </svg>
  );
}

/** Three path lights on the lawn edge, bottom right of the intro. Decorative. */
function Glow() {
  const lights = [
    { x: 60, y: 150, s: 1 },
    { x: 150, y: 128, s: 0.8 },
    { x: 222, y: 112, s: 0.64 },
  ];
  return (
    <svg viewBox="0 0 280 180" className="pointer-events-none absolute right-0 bottom-0 h-32 w-auto sm:h-48" aria-hidden="true">
      <defs>
        <radialGradient id="portal-pool" cx="50%" cy="50%" r="50%">
          <stop offset="0" stopColor="#ffd899" stopOpacity="0.7" />
          <stop offset="0.5" stopColor="#f5a83a" stopOpacity="0.25" />
          <stop offset="1" stopColor="#f5a83a" stopOpacity="0" />
        </radialGradient>
      </defs>
      {lights.map(({ x, y, s }) => (
        <g key={x} transform={`translate(${x} ${y}) scale(${s})`}>
          <ellipse cx="0" cy="22" rx="58" ry="18" fill="url(#portal-pool)" />
          <rect x="-2.5" y="-24" width="5" height="46" rx="2" fill="#0b1024" />
          <path d="M-10 -24h20l-4-8h-12z" fill="#0b1024" />
          <rect x="-7" y="-24" width="14" height="4.5" rx="1.5" fill="#ffd899" />
        </g>
      ))}
    </svg>
  );
}
