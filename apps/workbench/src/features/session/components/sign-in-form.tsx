import { SignInRequest, type SessionUser } from '@gloaming/contracts';
import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { FormMessage } from '../../../components/ui/form-message';
import { TextField } from '../../../components/ui/text-field';
import { fromRequestError, fromSchemaIssues, type FormErrors } from '../../../lib/form-errors';
import { useSignIn } from '../api/sign-in';

const FIELDS = ['email', 'password'] as const;
type Field = (typeof FIELDS)[number];

const SIGN_IN_TITLES = { 401: 'Could not sign you in', 429: 'Sign-in paused' };

export function SignInForm({ onSignedIn }: { onSignedIn: (user: SessionUser) => void }) {
  const signIn = useSignIn();
  const [errors, setErrors] = useState<FormErrors<Field>>({ fields: {} });

  function handleSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const parsed = SignInRequest.safeParse({ email: data.get('email'), password: data.get('password') });
    if (!parsed.success) {
      setErrors(fromSchemaIssues(parsed.error.issues, FIELDS));
      return;
    }
    setErrors({ fields: {} });
    signIn.mutate(parsed.data, {
      onSuccess: onSignedIn,
      onError: (error) => setErrors(fromRequestError(error, FIELDS, SIGN_IN_TITLES)),
    });
  }

  return (
    <form noValidate onSubmit={handleSubmit} aria-label="Sign in">
      <FormMessage tone="error" title={errors.form?.title} testId="sign-in-message">
        {errors.form?.detail}
      </FormMessage>
      <div className="flex flex-col gap-5">
        <TextField
          label="E-mail"
          name="email"
          type="email"
          autoComplete="username"
          inputMode="email"
          spellCheck={false}
          required
          error={errors.fields.email}
        />
        <TextField
          label="Password"
          name="password"
          type="password"
          autoComplete="current-password"
          required
          error={errors.fields.password}
          labelAside={
            <Link to="/forgot-password" className="text-caption font-medium text-dusk-600 underline-offset-4 hover:underline">
              Forgot password?
            </Link>
          }
        />
        <Button type="submit" fullWidth busy={signIn.isPending} className="mt-1">
          {signIn.isPending ? 'Signing in…' : 'Sign in'}
        </Button>
      </div>
    </form>
  );
}
