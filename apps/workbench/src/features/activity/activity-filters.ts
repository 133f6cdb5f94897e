import type { ActivityFilters } from './api/activity-keys';

/** The filters live in the address (?person=…&kind=…), so a filtered log can be shared or reloaded. */
export function activityFiltersFrom(params: URLSearchParams): ActivityFilters {
  const kind = params.get('kind');
  const person = params.get('person');
  return { ...(person ? { actorId: person } : {}), ...(kind === 'quote' || kind === 'firm' ? { kind } : {}) };
}
