import { EmailToken, PasswordResetComplete } from '@gloaming/contracts';
import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { FormMessage } from '../../../components/ui/form-message';
import { fromRequestError, fromSchemaIssues, type FormErrors } from '../../../lib/form-errors';
import { AuthFrame } from '../../session/components/auth-frame';
import { LinkProblem } from '../../session/components/link-problem';
import { NewPasswordForm, type NewPasswordField } from '../../session/components/new-password-form';
import { useCompletePasswordReset } from '../api/complete-password-reset';

const FIELDS = ['password', 'confirmation'] as const satisfies ReadonlyArray<NewPasswordField>;

export function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const complete = useCompletePasswordReset();
  const [errors, setErrors] = useState<FormErrors<NewPasswordField>>({ fields: {} });

  function handleSubmit(password: string) {
    const parsed = PasswordResetComplete.safeParse({ token, password });
    if (!parsed.success) {
      setErrors(fromSchemaIssues(parsed.error.issues, FIELDS));
      return;
    }
    setErrors({ fields: {} });
    complete.mutate(parsed.data, { onError: (error) => setErrors(fromRequestError(error, FIELDS)) });
  }

  return (
    <AuthFrame title="Choose a new password" intro="The link from your e-mail works once and for a limited time.">
      <FormMessage tone="success" title="Password changed">
        {complete.data ? (
          <>
            {complete.data.message}{' '}
            <Link to="/sign-in" className="font-semibold underline underline-offset-4">
              Sign in
            </Link>
          </>
        ) : null}
      </FormMessage>
      {complete.isSuccess ? null : EmailToken.safeParse(token).success ? (
        <NewPasswordForm
          label="Choose a new password"
          submitLabel="Save new password"
          busy={complete.isPending}
          errors={errors}
          onSubmit={handleSubmit}
        />
      ) : (
        <LinkProblem>
          The reset link is incomplete. Open it again from the e-mail, or{' '}
          <Link to="/forgot-password" className="font-semibold underline underline-offset-4">
            ask for a new one
          </Link>
          .
        </LinkProblem>
      )}
      {complete.isSuccess ? null : (
        <p className="mt-8 text-caption text-ink-muted">
          Link expired or already used?{' '}
          <Link to="/forgot-password" className="font-medium text-dusk-600 underline underline-offset-4">
            Ask for a new one
          </Link>
        </p>
      )}
    </AuthFrame>
  );
}
