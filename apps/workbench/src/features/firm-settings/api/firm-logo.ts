import { FirmSettingsResponse, LOGO_UPLOAD_FIELD } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { firmSettingsKeys } from './firm-settings-keys';

/** Where the firm's logo is served (GET /api/organization/logo); `stamp` busts the browser's cache. */
export const firmLogoUrl = (stamp: string) => `/api/organization/logo?v=${encodeURIComponent(stamp)}`;

/** PUT /api/organization/logo: one image (PNG, JPEG or WebP) as multipart. */
export async function uploadFirmLogo(file: File): Promise<FirmSettingsResponse> {
  const body = new FormData();
  body.append(LOGO_UPLOAD_FIELD, file);
  return apiRequest('/organization/logo', { method: 'PUT', body, schema: FirmSettingsResponse });
}

/** DELETE /api/organization/logo. */
export async function removeFirmLogo(): Promise<FirmSettingsResponse> {
  return apiRequest('/organization/logo', { method: 'DELETE', schema: FirmSettingsResponse });
}

/** The answer is the whole settings (the logo moves the firm's version), cached as the server's truth. */
function useLogoMutation<T>(fn: (input: T) => Promise<FirmSettingsResponse>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (answer) => queryClient.setQueryData(firmSettingsKeys.current(), answer),
  });
}

export const useUploadFirmLogo = () => useLogoMutation(uploadFirmLogo);
export const useRemoveFirmLogo = () => useLogoMutation(() => removeFirmLogo());
