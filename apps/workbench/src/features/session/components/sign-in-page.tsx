import type { SessionUser } from '@gloaming/contracts';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { ROLE_HOME, safeReturnPath } from '../role-home';
import { AuthFrame } from './auth-frame';
import { SignInForm } from './sign-in-form';

export function SignInPage() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const signedOut = params.get('signed-out') === '1';

  function handleSignedIn(user: SessionUser) {
    navigate(safeReturnPath(params.get('next')) ?? ROLE_HOME[user.role], { replace: true });
  }

  return (
    <AuthFrame
      title="Sign in to Gloaming"
      intro={signedOut ? 'You have signed out. Sign in again to carry on.' : 'Use the e-mail address your firm invited.'}
    >
      <SignInForm onSignedIn={handleSignedIn} />
      <p className="mt-8 border-t border-line pt-6 text-caption text-ink-muted">
        New to your firm’s workspace? Ask its owner to send you an invitation; the link in that e-mail lets you set a password.
      </p>
    </AuthFrame>
  );
}
