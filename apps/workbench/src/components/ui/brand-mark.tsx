/** Gloaming's mark: a path light under a rising glow. Decorative; the word beside it names it. */
export function BrandMark({ className = 'size-8' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <defs>
        <radialGradient id="brand-glow" cx="50%" cy="42%" r="50%">
          <stop offset="0%" stopColor="#ffc266" stopOpacity="0.55" />
          <stop offset="100%" stopColor="#ffc266" stopOpacity="0" />
        </radialGradient>
      </defs>
      <rect width="32" height="32" rx="9" fill="#1b2552" />
      <circle cx="16" cy="14" r="12" fill="url(#brand-glow)" />
      <path d="M9 24.5h14" stroke="#7182c8" strokeWidth="1.75" strokeLinecap="round" />
      <path d="M16 24.5v-7" stroke="#c7cff0" strokeWidth="2" strokeLinecap="round" />
      <path d="M12.5 15.5h7l-1.2-3.2a1 1 0 0 0-.94-.65h-2.72a1 1 0 0 0-.94.65z" fill="#ffc266" />
    </svg>
  );
}

export function Wordmark({ tone = 'dark' }: { tone?: 'dark' | 'light' }) {
  return (
    <span className="flex items-center gap-2.5">
      <BrandMark />
      <span className={`text-lead font-semibold tracking-tight ${tone === 'light' ? 'text-white' : 'text-dusk-900'}`}>
        Gloaming
      </span>
    </span>
  );
}
