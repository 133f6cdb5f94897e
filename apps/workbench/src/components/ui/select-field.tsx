import { useId, type SelectHTMLAttributes } from 'react';
import { FieldErrorText } from './text-field';

export type SelectFieldProps = Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> & {
  label: string;
  options: ReadonlyArray<{ value: string; label: string }>;
  error?: string | undefined;
};

export function SelectField({ label, options, error, className = '', ...select }: SelectFieldProps) {
  const id = useId();
  const errorId = `${id}-error`;
  return (
    <div className={`flex flex-col gap-1.5 ${className}`}>
      <label htmlFor={id} className="text-caption font-semibold text-mist-800">
        {label}
      </label>
      <div className="relative">
        <select
          id={id}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? errorId : undefined}
          className={`h-11 w-full appearance-none rounded-control bg-surface pr-10 pl-3.5 text-body text-ink shadow-control ring-1 ring-inset focus-visible:outline-offset-0 ${
            error ? 'ring-2 ring-danger' : 'ring-line-strong hover:ring-mist-500'
          }`}
          {...select}
        >
          {options.map((option) => (
            <option key={option.value} value={option.value}>
              {option.label}
            </option>
          ))}
        </select>
        <svg
          viewBox="0 0 16 16"
          className="pointer-events-none absolute top-1/2 right-3.5 size-4 -translate-y-1/2 text-mist-500"
          aria-hidden="true"
        >
          <path d="m4 6 4 4 4-4" fill="none" stroke="currentColor" strokeWidth="1.75" strokeLinecap="round" />
        </svg>
      </div>
      {error ? <FieldErrorText id={errorId}>{error}</FieldErrorText> : null}
    </div>
  );
}
