import { ROLE_LABELS } from '@gloaming/contracts';
import { useSearchParams } from 'react-router-dom';
import { FormMessage } from '../../../components/ui/form-message';
import { PageHeader } from '../../../components/ui/page-header';
import { SelectField } from '../../../components/ui/select-field';
import { useTeam } from '../../team/api/get-team';
import { useFirmActivity } from '../api/list-activity';
import { ActivityList } from './activity-list';
import { activityFiltersFrom } from '../activity-filters';

const KIND_OPTIONS = [
  { value: '', label: 'Everything' },
  { value: 'quote', label: 'Quotes' },
  { value: 'firm', label: 'Settings and team' },
];

/** The owner's log of who did what, when, across the firm. */
export function ActivityPage() {
  const [params, setParams] = useSearchParams();
  const filters = activityFiltersFrom(params);
  const log = useFirmActivity(filters);
  const team = useTeam();
  const set = (key: 'person' | 'kind', value: string) =>
    setParams(
      (p) => {
        const next = new URLSearchParams(p);
        if (value) next.set(key, value);
        else next.delete(key);
        return next;
      },
      { replace: true },
    );
  const people = [
    { value: '', label: 'Everyone' },
    ...(team.data ?? []).map((m) => ({ value: m.id, label: `${m.name} (${ROLE_LABELS[m.role].toLowerCase()})` })),
  ];
  const entries = log.data?.pages.flatMap((p) => p.entries) ?? [];

  return (
    <div className="mx-auto flex max-w-4xl flex-col">
      <PageHeader eyebrow="Owner" title="Activity">
        Who did what, and when: quotes made, sent, viewed and decided, deposits, settings and team changes.
      </PageHeader>
      <div className="mb-6 grid gap-4 sm:grid-cols-2" role="group" aria-label="Filter the activity">
        <SelectField label="Person" options={people} value={filters.actorId ?? ''} onChange={(e) => set('person', e.target.value)} />
        <SelectField label="Kind" options={KIND_OPTIONS} value={filters.kind ?? ''} onChange={(e) => set('kind', e.target.value)} />
      </div>
      {log.isError ? (
        <FormMessage tone="error" title="The activity could not be loaded">
          {log.error.message}
        </FormMessage>
      ) : log.data ? (
        <div aria-busy={log.isFetching && !log.isFetchingNextPage} className={log.isPlaceholderData ? 'opacity-60' : ''}>
          <ActivityList entries={entries} hasMore={log.hasNextPage} loadingMore={log.isFetchingNextPage} onMore={() => void log.fetchNextPage()} />
        </div>
      ) : (
        <p className="text-body text-ink-muted">Loading the activity…</p>
      )}
    </div>
  );
}
