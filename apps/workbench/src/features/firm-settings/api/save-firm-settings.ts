import { FirmSettingsResponse, type UpdateFirmSettingsRequest } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { firmSettingsKeys } from './firm-settings-keys';

/** PUT /api/organization/settings: saves every setting; a stale version answers 409. */
export async function saveFirmSettings(request: UpdateFirmSettingsRequest): Promise<FirmSettingsResponse> {
  return apiRequest('/organization/settings', { method: 'PUT', body: request, schema: FirmSettingsResponse });
}

export function useSaveFirmSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveFirmSettings,
    onSuccess: (saved) => queryClient.setQueryData(firmSettingsKeys.current(), saved),
    onSettled: () => queryClient.invalidateQueries({ queryKey: firmSettingsKeys.all }),
  });
}
