import { useId, useState, type FormEvent } from 'react';
import type { PortalQuoteView } from '@gloaming/contracts';
import { Button } from '../../../components/ui/button';
import type { Formatters } from '../../../components/ui/format';
import { FieldMessage } from '../../../components/ui/field-message';
import { isApiError } from '../../../lib/api-error';
import { useAskQuestion } from '../api/ask-question';

/** The conversation with the firm, and a box to ask something. Replies arrive by e-mail too. */
export function QuestionThread({ token, quote, f }: { token: string; quote: PortalQuoteView; f: Formatters }) {
  const ask = useAskQuestion(token);
  const [body, setBody] = useState('');
  const [sent, setSent] = useState(false);
  const id = useId();
  const error = isApiError(ask.error) ? ask.error : null;

  function submit(e: FormEvent) {
    e.preventDefault();
    setSent(false);
    ask.run(body, () => {
      setBody('');
      setSent(true);
    });
  }

  return (
    <div className="flex flex-col gap-4">
      {quote.messages.length > 0 && (
        <ol className="flex flex-col gap-3">
          {quote.messages.map((m) => (
            <li
              key={m.id}
              className={`rounded-card p-3 ring-1 ${m.from === 'homeowner' ? 'ml-6 bg-dusk-50 ring-dusk-200' : 'mr-6 bg-surface ring-line'}`}
            >
              <p className="text-caption text-ink-muted">
                {m.from === 'homeowner' ? 'You' : m.authorName} · {f.date(m.at)}
              </p>
              <p className="mt-1 whitespace-pre-wrap">{m.body}</p>
            </li>
          ))}
        </ol>
      )}
      <form onSubmit={submit} className="flex flex-col gap-3">
        <div>
          <label htmlFor={`${id}-q`} className="block font-semibold">
            Your question
          </label>
          <textarea
            id={`${id}-q`}
            name="question"
            rows={3}
            maxLength={4000}
            value={body}
            onChange={(e) => setBody(e.target.value)}
            aria-invalid={error?.messageFor('body') ? true : undefined}
            aria-describedby={error?.messageFor('body') ? `${id}-q-error` : undefined}
            className="mt-1 block w-full rounded-control border border-line-strong bg-surface px-3 py-2"
          />
          <FieldMessage id={`${id}-q-error`} message={error?.messageFor('body')} />
        </div>
        {error && !error.fieldErrors.length && (
          <p role="alert" className="rounded-control bg-ember-50 p-3 font-semibold text-ember-700">
            {error.detail}
          </p>
        )}
        <p role="status" aria-live="polite" className="min-h-5 font-semibold text-leaf-700">
          {sent ? `Sent. ${quote.firm.contactName || quote.firm.name} will reply by e-mail.` : ''}
        </p>
        <Button type="submit" tone="secondary" disabled={ask.isPending || !body.trim()}>
          {ask.isPending ? 'Sending…' : 'Send question'}
        </Button>
      </form>
    </div>
  );
}
