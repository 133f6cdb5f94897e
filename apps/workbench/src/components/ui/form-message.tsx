import type { ReactNode } from 'react';

type Tone = 'error' | 'success' | 'info';

const TONE_CLASSES: Record<Tone, string> = {
  error: 'bg-ember-50 text-ember-700 ring-ember-600/30',
  success: 'bg-leaf-50 text-leaf-700 ring-leaf-700/30',
  info: 'bg-dusk-50 text-dusk-800 ring-dusk-300',
};

/**
 * A live region that is always in the document, so screen readers announce the message when it
 * appears. Errors are assertive (role="alert"); other messages are polite (role="status").
 */
export function FormMessage({
  tone,
  title,
  children,
  testId,
}: {
  tone: Tone;
  title?: string | undefined;
  children?: ReactNode;
  testId?: string;
}) {
  const hasMessage = children !== undefined && children !== null && children !== false && children !== '';
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} data-testid={testId}>
      {hasMessage ? (
        <div className={`mb-5 flex gap-3 rounded-control px-4 py-3 text-caption ring-1 ring-inset ${TONE_CLASSES[tone]}`}>
          <ToneIcon tone={tone} />
          <div className="flex flex-col gap-0.5">
            {title ? <p className="font-semibold">{title}</p> : null}
            <div>{children}</div>
          </div>
        </div>
      ) : null}
    </div>
  );
}

function ToneIcon({ tone }: { tone: Tone }) {
  if (tone === 'success') {
    return (
      <svg viewBox="0 0 20 20" className="mt-px size-4.5 shrink-0" aria-hidden="true">
        <circle cx="10" cy="10" r="9" fill="currentColor" />
        <path d="m6 10.5 2.5 2.5L14 7.5" fill="none" stroke="white" strokeWidth="2" strokeLinecap="round" />
      </svg>
    );
  }
  return (
    <svg viewBox="0 0 20 20" className="mt-px size-4.5 shrink-0" aria-hidden="true">
      <circle cx="10" cy="10" r="9" fill="currentColor" />
      <path
        d={tone === 'error' ? 'M10 5.5v5.5M10 14.25h.01' : 'M10 9v5.5M10 5.75h.01'}
        stroke="white"
        strokeWidth="2"
        strokeLinecap="round"
      />
    </svg>
  );
}
