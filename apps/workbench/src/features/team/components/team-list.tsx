import { ROLE_LABELS, type TeamMember } from '@gloaming/contracts';
import { Badge } from '../../../components/ui/badge';
import { Initials } from '../../../components/ui/initials';

const STATUS: Record<TeamMember['status'], { label: string; tone: 'positive' | 'pending' | 'muted' }> = {
  active: { label: 'Active', tone: 'positive' },
  invited: { label: 'Invited', tone: 'pending' },
  deactivated: { label: 'Deactivated', tone: 'muted' },
};

const ROLE_ORDER: Record<TeamMember['role'], number> = { owner: 0, estimator: 1, installer: 2 };

export function TeamList({ members, currentUserId }: { members: readonly TeamMember[]; currentUserId: string }) {
  const sorted = [...members].sort((a, b) => ROLE_ORDER[a.role] - ROLE_ORDER[b.role] || a.name.localeCompare(b.name, 'en-GB'));
  return (
    <table className="w-full text-left text-body">
      <caption className="sr-only">Team members, their role and whether they can sign in</caption>
      <thead>
        <tr className="border-b border-line text-caption text-ink-muted">
          <th scope="col" className="pb-2.5 font-semibold">
            Name
          </th>
          <th scope="col" className="pb-2.5 font-semibold">
            Role
          </th>
          <th scope="col" className="pb-2.5 text-right font-semibold">
            Status
          </th>
        </tr>
      </thead>
      <tbody>
        {sorted.map((member) => (
          <tr key={member.id} className="border-b border-line last:border-0">
            <td className="py-3 pr-4">
              <div className="flex items-center gap-3">
                <Initials name={member.name} />
                <div className="min-w-0">
                  <p className="truncate font-medium text-ink">
                    {member.name}
                    {member.id === currentUserId ? <span className="font-normal text-ink-muted"> (you)</span> : null}
                  </p>
                  <p className="truncate text-caption text-ink-muted">{member.email}</p>
                </div>
              </div>
            </td>
            <td className="py-3 pr-4 text-mist-700">{ROLE_LABELS[member.role]}</td>
            <td className="py-3 text-right">
              <Badge tone={STATUS[member.status].tone}>{STATUS[member.status].label}</Badge>
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
