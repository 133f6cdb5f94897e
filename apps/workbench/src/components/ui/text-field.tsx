import { useId, type InputHTMLAttributes, type ReactNode } from 'react';

export type TextFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> & {
  label: string;
  /** Shown under the field and announced with it when it is invalid. */
  error?: string | undefined;
  hint?: ReactNode;
  /** Something to place at the right end of the label row, such as a link. */
  labelAside?: ReactNode;
};

export function TextField({ label, error, hint, labelAside, className = '', ...input }: TextFieldProps) {
  const id = useId();
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ') || undefined;

  return (
    <div className={`flex flex-col gap-1.5 ${className}`}>
      <div className="flex items-baseline justify-between gap-4">
        <label htmlFor={id} className="text-caption font-semibold text-mist-800">
          {label}
        </label>
        {labelAside}
      </div>
      <input
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`h-11 w-full rounded-control bg-surface px-3.5 text-body text-ink shadow-control ring-1 ring-inset placeholder:text-mist-400 focus-visible:outline-offset-0 ${
          error ? 'ring-2 ring-danger' : 'ring-line-strong hover:ring-mist-500'
        }`}
        {...input}
      />
      {hint ? (
        <p id={hintId} className="text-caption text-ink-muted">
          {hint}
        </p>
      ) : null}
      {error ? <FieldErrorText id={errorId}>{error}</FieldErrorText> : null}
    </div>
  );
}

export function FieldErrorText({ id, children }: { id: string; children: ReactNode }) {
  return (
    <p id={id} className="flex items-start gap-1.5 text-caption font-medium text-ember-700">
      <svg viewBox="0 0 16 16" className="mt-0.5 size-3.5 shrink-0" aria-hidden="true">
        <circle cx="8" cy="8" r="7" fill="currentColor" />
        <path d="M8 4.5v4M8 11h.01" stroke="white" strokeWidth="1.75" strokeLinecap="round" />
      </svg>
      <span>{children}</span>
    </p>
  );
}
