import { FirmSettingsResponse } from '@gloaming/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { firmSettingsKeys } from './firm-settings-keys';

/** GET /api/organization/settings (owner only): every setting, its version and whether a logo is set. */
export async function fetchFirmSettings(signal?: AbortSignal): Promise<FirmSettingsResponse> {
  return apiRequest('/organization/settings', { schema: FirmSettingsResponse, ...(signal ? { signal } : {}) });
}

export const firmSettingsQueryOptions = () =>
  queryOptions({
    queryKey: firmSettingsKeys.current(),
    queryFn: ({ signal }) => fetchFirmSettings(signal),
  });

export function useFirmSettings() {
  return useQuery(firmSettingsQueryOptions());
}
