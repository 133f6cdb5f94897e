import type { ReactNode } from 'react';

type Tone = 'neutral' | 'positive' | 'pending' | 'muted';

const TONE_CLASSES: Record<Tone, string> = {
  neutral: 'bg-dusk-50 text-dusk-700 ring-dusk-200',
  positive: 'bg-leaf-50 text-leaf-700 ring-leaf-700/25',
  pending: 'bg-lamp-50 text-lamp-800 ring-lamp-300',
  muted: 'bg-mist-100 text-mist-600 ring-mist-300',
};

export function Badge({ tone = 'neutral', children }: { tone?: Tone; children: ReactNode }) {
  return (
    <span
      className={`inline-flex items-center gap-1.5 rounded-pill px-2.5 py-0.5 text-micro font-semibold ring-1 ring-inset ${TONE_CLASSES[tone]}`}
    >
      {children}
    </span>
  );
}
