import { useId, type TextareaHTMLAttributes } from 'react';
import { FieldErrorText } from './text-field';

export type TextAreaFieldProps = Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> & {
  label: string;
  error?: string | undefined;
};

export function TextAreaField({ label, error, className = '', rows = 3, ...textarea }: TextAreaFieldProps) {
  const id = useId();
  const errorId = `${id}-error`;
  return (
    <div className={`flex flex-col gap-1.5 ${className}`}>
      <label htmlFor={id} className="text-caption font-semibold text-mist-800">
        {label}
      </label>
      <textarea
        id={id}
        rows={rows}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? errorId : undefined}
        className={`w-full rounded-control bg-surface px-3.5 py-2.5 text-body text-ink shadow-control ring-1 ring-inset focus-visible:outline-offset-0 ${
          error ? 'ring-2 ring-danger' : 'ring-line-strong hover:ring-mist-500'
        }`}
        {...textarea}
      />
      {error ? <FieldErrorText id={errorId}>{error}</FieldErrorText> : null}
    </div>
  );
}
