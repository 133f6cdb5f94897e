import { UpdateFirmSettingsRequest } from '@gloaming/contracts';
import type { ModuleDeps } from '../../app-deps';
import { allowRoles, anySignedIn, moduleRouter, route, type RegisteredRoute } from '../../http/routes';
import { notFound } from '../../http/problem';
import { loadFirm, presentFirmSettings, removeLogo, replaceLogo, saveFirmSettings } from './service';

const ownerOnly = allowRoles('owner');

export function firmSettingsRouter(deps: ModuleDeps, registry: RegisteredRoute[]) {
  const { storage } = deps;
  return moduleRouter('/api/organization', registry, [
    route({
      method: 'get',
      path: '/settings',
      summary: "The firm's settings, for the owner to edit",
      policy: ownerOnly,
      handler: async ({ res, em, auth }) => {
        res.json(presentFirmSettings(await loadFirm(em, auth.organizationId)));
      },
    }),
    route({
      method: 'put',
      path: '/settings',
      summary: "Save the firm's settings (new quotes use them; sent revisions keep theirs)",
      policy: ownerOnly,
      schemas: { body: UpdateFirmSettingsRequest },
      handler: async ({ res, em, input, auth }) => {
        const firm = await saveFirmSettings(em, auth.organizationId, auth.user.id, input.body.version, input.body.settings);
        res.json(presentFirmSettings(firm));
      },
    }),
    route({
      method: 'get',
      path: '/logo',
      summary: "The firm's logo image",
      policy: anySignedIn,
      handler: async ({ res, em, auth }) => {
        const firm = await loadFirm(em, auth.organizationId);
        if (!firm.logoPath) throw notFound('A logo');
        const bytes = await storage.get(firm.logoPath);
        res.setHeader('Cache-Control', 'private, max-age=60');
        res.type(firm.logoContentType ?? 'image/png').send(bytes);
      },
    }),
    route({
      method: 'put',
      path: '/logo',
      summary: 'Upload a new logo (multipart, field "file"; PNG, JPEG or WebP)',
      policy: ownerOnly,
      handler: async ({ req, res, em, auth }) => {
        res.json(presentFirmSettings(await replaceLogo(em, storage, auth.organizationId, auth.user.id, req, res)));
      },
    }),
    route({
      method: 'delete',
      path: '/logo',
      summary: 'Remove the logo',
      policy: ownerOnly,
      handler: async ({ res, em, auth }) => {
        res.json(presentFirmSettings(await removeLogo(em, storage, auth.organizationId, auth.user.id)));
      },
    }),
  ]);
}
