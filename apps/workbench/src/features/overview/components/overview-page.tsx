import { Card } from '../../../components/ui/card';
import { FormMessage } from '../../../components/ui/form-message';
import { PageHeader } from '../../../components/ui/page-header';
import { useSignedInUser } from '../../session/hooks/use-signed-in-user';
import { useTeam } from '../../team/api/get-team';
import { InviteForm } from '../../team/components/invite-form';
import { TeamList } from '../../team/components/team-list';

export function OverviewPage() {
  const user = useSignedInUser();
  const team = useTeam();
  const members = team.data ?? [];
  const active = members.filter((member) => member.status === 'active').length;
  const invited = members.filter((member) => member.status === 'invited').length;
  const countRole = (role: 'estimator' | 'installer') =>
    members.filter((member) => member.role === role && member.status !== 'deactivated').length;

  return (
    <>
      <title>{`Overview · ${user.organization.name} · Gloaming`}</title>
      <PageHeader eyebrow={user.organization.name} title="Overview">
        Who works in your firm’s workspace, and invitations for new estimators and installers.
      </PageHeader>

      <dl className="mb-8 grid gap-4 sm:grid-cols-3">
        <Figure label="People who can sign in" value={team.data ? String(active) : '–'} />
        <Figure label="Invitations waiting" value={team.data ? String(invited) : '–'} />
        <Figure
          label="Estimators / installers"
          value={team.data ? `${countRole('estimator')} / ${countRole('installer')}` : '–'}
        />
      </dl>

      <div className="grid items-start gap-6 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <Card title="Team" description="Everyone with access to this workspace. Invited people appear once the e-mail is sent.">
          {team.isPending ? (
            <p className="text-ink-muted" role="status">
              Loading the team…
            </p>
          ) : team.isError ? (
            <FormMessage tone="error" title="The team could not be loaded">
              {team.error.message}
            </FormMessage>
          ) : (
            <TeamList members={members} currentUserId={user.id} />
          )}
        </Card>
        <Card title="Invite a team member" description="They receive an e-mail with a link to choose a password.">
          <InviteForm />
        </Card>
      </div>
    </>
  );
}

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div className="rounded-card bg-surface px-5 py-4 shadow-card ring-1 ring-line">
      <dt className="text-caption text-ink-muted">{label}</dt>
      <dd className="mt-1 font-mono text-heading font-semibold text-ink">{value}</dd>
    </div>
  );
}
