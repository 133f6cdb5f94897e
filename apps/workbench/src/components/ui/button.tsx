import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'quiet';

const VARIANT_CLASSES: Record<Variant, string> = {
  primary:
    'bg-accent text-accent-ink shadow-control hover:bg-lamp-300 active:bg-lamp-500 disabled:bg-mist-200 disabled:text-mist-600',
  secondary:
    'bg-surface text-dusk-800 ring-1 ring-inset ring-mist-300 hover:bg-dusk-50 hover:ring-dusk-300 disabled:text-mist-500',
  quiet: 'text-dusk-700 hover:bg-dusk-50 disabled:text-mist-500',
};

export type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & {
  variant?: Variant;
  /** Shows a working state and blocks repeat presses while a request is in flight. */
  busy?: boolean;
  fullWidth?: boolean;
};

export function Button({
  variant = 'primary',
  busy = false,
  fullWidth = false,
  className = '',
  children,
  disabled,
  type = 'button',
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      className={`inline-flex h-11 items-center justify-center gap-2 rounded-control px-5 text-body font-semibold transition-colors disabled:cursor-not-allowed ${
        fullWidth ? 'w-full' : ''
      } ${VARIANT_CLASSES[variant]} ${className}`}
      {...rest}
    >
      {busy ? <Spinner /> : null}
      {children}
    </button>
  );
}

function Spinner() {
  return (
    <svg className="size-4 animate-spin" viewBox="0 0 16 16" aria-hidden="true">
      <circle cx="8" cy="8" r="6" fill="none" stroke="currentColor" strokeOpacity="0.25" strokeWidth="2" />
      <path d="M14 8a6 6 0 0 0-6-6" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
    </svg>
  );
}
