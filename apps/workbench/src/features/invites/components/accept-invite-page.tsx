import { AcceptInviteRequest, EmailToken } from '@gloaming/contracts';
import { useState } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { fromRequestError, fromSchemaIssues, type FormErrors } from '../../../lib/form-errors';
import { AuthFrame } from '../../session/components/auth-frame';
import { LinkProblem } from '../../session/components/link-problem';
import { NewPasswordForm, type NewPasswordField } from '../../session/components/new-password-form';
import { ROLE_HOME } from '../../session/role-home';
import { useAcceptInvite } from '../api/accept-invite';

const FIELDS = ['password', 'confirmation'] as const satisfies ReadonlyArray<NewPasswordField>;

export function AcceptInvitePage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const navigate = useNavigate();
  const accept = useAcceptInvite();
  const [errors, setErrors] = useState<FormErrors<NewPasswordField>>({ fields: {} });

  function handleSubmit(password: string) {
    const parsed = AcceptInviteRequest.safeParse({ token, password });
    if (!parsed.success) {
      setErrors(fromSchemaIssues(parsed.error.issues, FIELDS));
      return;
    }
    setErrors({ fields: {} });
    accept.mutate(parsed.data, {
      onSuccess: (user) => navigate(ROLE_HOME[user.role], { replace: true }),
      onError: (error) => setErrors(fromRequestError(error, FIELDS)),
    });
  }

  return (
    <AuthFrame
      title="Join your team on Gloaming"
      intro="Choose the password you will sign in with. Your e-mail address is the one the invitation was sent to."
    >
      {EmailToken.safeParse(token).success ? (
        <NewPasswordForm
          label="Accept invitation"
          submitLabel="Accept invitation"
          busy={accept.isPending}
          errors={errors}
          onSubmit={handleSubmit}
        />
      ) : (
        <LinkProblem>
          The invitation link is incomplete. Open it again from the e-mail, or ask the owner of your firm to send a new
          invitation.
        </LinkProblem>
      )}
    </AuthFrame>
  );
}
