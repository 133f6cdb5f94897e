import { ROLE_LABELS, ROLES, Role, type TeamMember } from '@gloaming/contracts';
import { useState } from 'react';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { FormMessage } from '../../../components/ui/form-message';
import { Initials } from '../../../components/ui/initials';
import { useUpdateMember } from '../api/update-member';

const STATUS: Record<TeamMember['status'], { label: string; tone: 'positive' | 'pending' | 'muted' }> = {
  active: { label: 'Active', tone: 'positive' },
  invited: { label: 'Invited', tone: 'pending' },
  deactivated: { label: 'Deactivated', tone: 'muted' },
};

const ROLE_ORDER: Record<TeamMember['role'], number> = { owner: 0, estimator: 1, installer: 2 };

export function TeamList({ members, currentUserId }: { members: readonly TeamMember[]; currentUserId: string }) {
  const update = useUpdateMember();
  const [problem, setProblem] = useState<string | null>(null);
  const change = (member: TeamMember, body: { role?: Role; active?: boolean }) => {
    setProblem(null);
    update.mutate({ id: member.id, change: body }, { onError: (e) => setProblem(e.message) });
  };
  const sorted = [...members].sort((a, b) => ROLE_ORDER[a.role] - ROLE_ORDER[b.role] || a.name.localeCompare(b.name, 'en-GB'));
  return (
    <>
      <FormMessage tone="error" title="That change was refused">
        {problem}
      </FormMessage>
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
            <th scope="col" className="pb-2.5 text-right font-semibold">
              <span className="sr-only">Actions</span>
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
              <td className="py-3 pr-4 text-mist-700">
                <label className="sr-only" htmlFor={`role-${member.id}`}>
                  Role of {member.name}
                </label>
                <select
                  id={`role-${member.id}`}
                  value={member.role}
                  disabled={update.isPending || member.status === 'deactivated'}
                  onChange={(e) => {
                    const role = Role.safeParse(e.target.value);
                    if (role.success) change(member, { role: role.data });
                  }}
                  className="h-9 rounded-control bg-surface px-2 text-body ring-1 ring-line-strong ring-inset"
                >
                  {ROLES.map((r) => (
                    <option key={r} value={r}>
                      {ROLE_LABELS[r]}
                    </option>
                  ))}
                </select>
              </td>
              <td className="py-3 text-right">
                <Badge tone={STATUS[member.status].tone}>{STATUS[member.status].label}</Badge>
              </td>
              <td className="py-3 pl-3 text-right">
                <Button
                  variant="quiet"
                  className="h-9 px-3"
                  disabled={update.isPending}
                  onClick={() => change(member, { active: member.status === 'deactivated' })}
                  aria-label={`${member.status === 'deactivated' ? 'Reactivate' : 'Deactivate'} ${member.name}`}
                >
                  {member.status === 'deactivated' ? 'Reactivate' : 'Deactivate'}
                </Button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </>
  );
}
