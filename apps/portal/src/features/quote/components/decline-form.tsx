import { useId, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { isApiError } from '../../../lib/api-error';
import { useDeclineQuote } from '../api/decline-quote';

/** Decline, with an optional reason; asked for only after "I do not want to go ahead". */
export function DeclineForm({ token }: { token: string }) {
  const decline = useDeclineQuote(token);
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const id = useId();
  const error = isApiError(decline.error) ? decline.error : null;

  function submit(e: FormEvent) {
    e.preventDefault();
    decline.run(reason.trim() ? { reason } : {});
  }

  if (!open)
    return (
      <Button
        tone="secondary"
        className="w-full"
        onClick={() => setOpen(true)}
        aria-expanded={false}
        aria-controls={`${id}-form`}
      >
        I do not want to go ahead
      </Button>
    );
  return (
    <form id={`${id}-form`} onSubmit={submit} className="flex flex-col gap-3">
      <div>
        <label htmlFor={`${id}-reason`} className="block font-semibold">
          Would you tell the firm why? (optional)
        </label>
        <textarea
          id={`${id}-reason`}
          name="reason"
          rows={3}
          maxLength={2000}
          value={reason}
          onChange={(e) => setReason(e.target.value)}
          className="mt-1 block w-full rounded-control border border-line-strong bg-surface px-3 py-2"
        />
      </div>
      {error && (
        <p role="alert" className="rounded-control bg-ember-50 p-3 font-semibold text-ember-700">
          {error.messageFor('reason') ?? error.detail}
        </p>
      )}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" tone="secondary" disabled={decline.isPending}>
          {decline.isPending ? 'Declining…' : 'Decline this quote'}
        </Button>
        <Button tone="quiet" onClick={() => setOpen(false)}>
          Keep the quote open
        </Button>
      </div>
    </form>
  );
}
