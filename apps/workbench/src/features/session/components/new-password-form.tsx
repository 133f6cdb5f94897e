import { MIN_PASSWORD_LENGTH } from '@gloaming/contracts';
import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { FormMessage } from '../../../components/ui/form-message';
import { TextField } from '../../../components/ui/text-field';
import type { FormErrors } from '../../../lib/form-errors';

export type NewPasswordField = 'password' | 'confirmation';

/**
 * Choose a password twice. The page checks the password against its contract and sends it; this
 * form only makes sure both copies match.
 */
export function NewPasswordForm({
  label,
  submitLabel,
  busy,
  errors,
  onSubmit,
}: {
  label: string;
  submitLabel: string;
  busy: boolean;
  errors: FormErrors<NewPasswordField>;
  onSubmit: (password: string) => void;
}) {
  const [mismatch, setMismatch] = useState(false);

  function handleSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const password = String(data.get('password') ?? '');
    const confirmation = String(data.get('confirmation') ?? '');
    const differs = password.length > 0 && password !== confirmation;
    setMismatch(differs);
    if (!differs) onSubmit(password);
  }

  return (
    <form noValidate onSubmit={handleSubmit} aria-label={label}>
      <FormMessage tone="error" title={errors.form?.title}>
        {errors.form?.detail}
      </FormMessage>
      <div className="flex flex-col gap-5">
        <TextField
          label="New password"
          name="password"
          type="password"
          autoComplete="new-password"
          required
          hint={`At least ${MIN_PASSWORD_LENGTH} characters. A short sentence is easy to remember and hard to guess.`}
          error={errors.fields.password}
        />
        <TextField
          label="Repeat new password"
          name="confirmation"
          type="password"
          autoComplete="new-password"
          required
          error={mismatch ? 'The two passwords are different. Type the same password twice.' : errors.fields.confirmation}
        />
        <Button type="submit" fullWidth busy={busy}>
          {submitLabel}
        </Button>
      </div>
    </form>
  );
}
