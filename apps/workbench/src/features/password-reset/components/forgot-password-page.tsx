import { PasswordResetRequest } from '@gloaming/contracts';
import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { FormMessage } from '../../../components/ui/form-message';
import { TextField } from '../../../components/ui/text-field';
import { AuthFrame } from '../../session/components/auth-frame';
import { fromRequestError, fromSchemaIssues, type FormErrors } from '../../../lib/form-errors';
import { useRequestPasswordReset } from '../api/request-password-reset';

const FIELDS = ['email'] as const;

export function ForgotPasswordPage() {
  const request = useRequestPasswordReset();
  const [errors, setErrors] = useState<FormErrors<(typeof FIELDS)[number]>>({ fields: {} });

  function handleSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const parsed = PasswordResetRequest.safeParse({ email: new FormData(event.currentTarget).get('email') });
    if (!parsed.success) {
      setErrors(fromSchemaIssues(parsed.error.issues, FIELDS));
      return;
    }
    setErrors({ fields: {} });
    request.mutate(parsed.data, { onError: (error) => setErrors(fromRequestError(error, FIELDS)) });
  }

  return (
    <AuthFrame
      title="Reset your password"
      intro="Enter the e-mail address you sign in with. We will send a link that lets you choose a new password."
    >
      <FormMessage tone="success" title="Check your inbox">
        {request.data?.message}
      </FormMessage>
      {request.isSuccess ? null : (
        <form noValidate onSubmit={handleSubmit} aria-label="Reset your password">
          <FormMessage tone="error" title={errors.form?.title}>
            {errors.form?.detail}
          </FormMessage>
          <div className="flex flex-col gap-5">
            <TextField
              label="E-mail"
              name="email"
              type="email"
              autoComplete="username"
              spellCheck={false}
              required
              error={errors.fields.email}
            />
            <Button type="submit" fullWidth busy={request.isPending}>
              Send reset link
            </Button>
          </div>
        </form>
      )}
      <p className="mt-8 text-caption text-ink-muted">
        Remembered it?{' '}
        <Link to="/sign-in" className="font-medium text-dusk-600 underline underline-offset-4">
          Back to sign in
        </Link>
      </p>
    </AuthFrame>
  );
}
