import type { OrganizationSummary } from '@gloaming/contracts';
import { Organization } from '@gloaming/db';
import type { ModuleDeps } from '../../app-deps';
import { anySignedIn, moduleRouter, route, type RegisteredRoute } from '../../http/routes';

export function presentOrganization(o: Organization): OrganizationSummary {
  return {
    id: o.id,
    name: o.name,
    addressLines: o.addressLines,
    vatNumber: o.vatNumber ?? null,
    currency: o.currency,
    locale: o.locale,
    vatRateBp: o.vatRateBp,
    depositPercentBp: o.depositPercentBp,
    markupPercentBp: o.markupPercentBp,
    labourRateMinorPerHour: o.labourRateMinorPerHour,
  };
}

export function organizationRouter(_deps: ModuleDeps, registry: RegisteredRoute[]) {
  return moduleRouter('/api/organization', registry, [
    route({
      method: 'get',
      path: '/',
      summary: "The signed-in user's firm",
      policy: anySignedIn,
      handler: async ({ res, em, auth }) => {
        const firm = await em.findOneOrFail(Organization, auth.organizationId);
        res.json({ organization: presentOrganization(firm) });
      },
    }),
  ]);
}
