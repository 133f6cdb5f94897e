import { useId, useState, type FormEvent } from 'react';
import type { PortalSelection } from '@gloaming/contracts';
import { Button } from '../../../components/ui/button';
import { FieldMessage } from '../../../components/ui/field-message';
import { isApiError } from '../../../lib/api-error';
import { useApproveQuote } from '../api/approve-quote';

/** Approve: the homeowner types their full name and accepts the terms. */
export function ApproveForm({ token, selection, total }: { token: string; selection: PortalSelection; total: string }) {
  const approve = useApproveQuote(token);
  const [name, setName] = useState('');
  const [accepted, setAccepted] = useState(false);
  const [local, setLocal] = useState<{ name?: string; terms?: string }>({});
  const id = useId();
  const error = isApiError(approve.error) ? approve.error : null;
  const nameError = local.name ?? error?.messageFor('signedName');
  const termsError = local.terms ?? error?.messageFor('termsAccepted');

  function submit(e: FormEvent) {
    e.preventDefault();
    const next = {
      ...(name.trim().length < 2 ? { name: 'Type your full name to approve.' } : {}),
      ...(!accepted ? { terms: 'Tick the box to accept the terms.' } : {}),
    };
    setLocal(next);
    if (next.name || next.terms) return;
    approve.run({ selection, signedName: name, termsAccepted: true });
  }

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      <p className="text-ink-muted">
        Approving tells the firm to go ahead with the work as chosen above, for <strong className="text-ink">{total}</strong>{' '}
        including VAT. The options you chose and the total are kept on record.
      </p>
      <div>
        <label htmlFor={`${id}-name`} className="block font-semibold">
          Your full name
        </label>
        <input
          id={`${id}-name`}
          name="signedName"
          autoComplete="name"
          value={name}
          onChange={(e) => setName(e.target.value)}
          aria-invalid={nameError ? true : undefined}
          aria-describedby={nameError ? `${id}-name-error` : undefined}
          className="mt-1 block min-h-12 w-full rounded-control border border-line-strong bg-surface px-3 py-2 text-lead"
        />
        <FieldMessage id={`${id}-name-error`} message={nameError} />
      </div>
      <div>
        <label className="flex cursor-pointer gap-3">
          <input
            type="checkbox"
            name="termsAccepted"
            checked={accepted}
            onChange={(e) => setAccepted(e.target.checked)}
            aria-invalid={termsError ? true : undefined}
            aria-describedby={termsError ? `${id}-terms-error` : undefined}
            className="mt-1 size-5 shrink-0 accent-dusk-600"
          />
          <span>I have read the terms of this quote and accept them.</span>
        </label>
        <FieldMessage id={`${id}-terms-error`} message={termsError} />
      </div>
      {error && !error.fieldErrors.length && (
        <p role="alert" className="rounded-control bg-ember-50 p-3 font-semibold text-ember-700">
          {error.detail}
        </p>
      )}
      <Button type="submit" disabled={approve.isPending}>
        {approve.isPending ? 'Approving…' : `Approve quote for ${total}`}
      </Button>
    </form>
  );
}
