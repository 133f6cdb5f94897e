import type { ButtonHTMLAttributes } from 'react';

type Tone = 'primary' | 'secondary' | 'quiet';

const TONES: Record<Tone, string> = {
  primary: 'bg-accent text-accent-ink shadow-control hover:bg-lamp-300 disabled:bg-mist-200 disabled:text-ink-muted',
  secondary: 'bg-surface text-ink ring-1 ring-line-strong hover:bg-mist-100 disabled:text-ink-muted',
  quiet: 'text-dusk-600 underline underline-offset-4 hover:text-dusk-800',
};

export function Button({
  tone = 'primary',
  className = '',
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { tone?: Tone }) {
  const shape = tone === 'quiet' ? 'px-1 py-2' : 'min-h-12 rounded-control px-5 py-3';
  return (
    <button
      type="button"
      {...props}
      className={`${shape} font-semibold disabled:cursor-not-allowed ${TONES[tone]} ${className}`}
    />
  );
}
