import { InviteRequest, Role, ROLE_LABELS, ROLES } from '@gloaming/contracts';
import { useRef, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { FormMessage } from '../../../components/ui/form-message';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { fromRequestError, fromSchemaIssues, type FormErrors } from '../../../lib/form-errors';
import { useInviteMember } from '../api/invite-member';

const FIELDS = ['name', 'email', 'role'] as const;
type Field = (typeof FIELDS)[number];

const ROLE_OPTIONS = ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));

const ROLE_SUMMARY: Record<Role, string> = {
  owner: 'Everything, including settings, users and figures.',
  estimator: 'Customers, quotes and the catalogue.',
  installer: 'Approved jobs, pick lists and wiring schedules, read-only.',
};

export function InviteForm() {
  const invite = useInviteMember();
  const formRef = useRef<HTMLFormElement>(null);
  const [errors, setErrors] = useState<FormErrors<Field>>({ fields: {} });
  const [role, setRole] = useState<Role>('estimator');
  const [sentTo, setSentTo] = useState<string | null>(null);

  function handleSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const parsed = InviteRequest.safeParse({ name: data.get('name'), email: data.get('email'), role: data.get('role') });
    setSentTo(null);
    if (!parsed.success) {
      setErrors(fromSchemaIssues(parsed.error.issues, FIELDS));
      return;
    }
    setErrors({ fields: {} });
    invite.mutate(parsed.data, {
      onSuccess: (member) => {
        setSentTo(`${member.name} (${member.email})`);
        formRef.current?.reset();
        setRole('estimator');
      },
      onError: (error) => setErrors(fromRequestError(error, FIELDS)),
    });
  }

  return (
    <form ref={formRef} noValidate onSubmit={handleSubmit} aria-label="Invite a team member">
      <FormMessage tone="success" title="Invitation sent">
        {sentTo ? `${sentTo} will get an e-mail with a link to set a password.` : null}
      </FormMessage>
      <FormMessage tone="error" title={errors.form?.title}>
        {errors.form?.detail}
      </FormMessage>
      <div className="flex flex-col gap-4">
        <TextField label="Full name" name="name" autoComplete="off" required error={errors.fields.name} />
        <TextField
          label="Work e-mail"
          name="email"
          type="email"
          autoComplete="off"
          spellCheck={false}
          required
          error={errors.fields.email}
        />
        <div className="flex flex-col gap-1.5">
          <SelectField
            label="Role"
            name="role"
            options={ROLE_OPTIONS}
            value={role}
            onChange={(event) => {
              const next = Role.safeParse(event.target.value);
              if (next.success) setRole(next.data);
            }}
            error={errors.fields.role}
          />
          <p className="text-caption text-ink-muted">{ROLE_SUMMARY[role]}</p>
        </div>
        <Button type="submit" busy={invite.isPending} className="mt-1 self-start">
          Send invitation
        </Button>
      </div>
    </form>
  );
}
