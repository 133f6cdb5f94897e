import {
  JobCircuitParams,
  JobParams,
  SaveAsWiredRequest,
  SaveCommissioningRequest,
  type JobListResponse,
  type SaveAsWiredResponse,
  type SaveCommissioningResponse,
} from '@gloaming/contracts';
import type { ModuleDeps } from '../../app-deps';
import { allowRoles, moduleRouter, route, type RegisteredRoute } from '../../http/routes';
import { validatedBody } from '../../http/validate';
import { sharedPdfRenderer } from '../quote-pdf/pdf-renderer';
import { buildInstallerPackPdfModel, installerPackFileName } from './pack-pdf-model';
import { buildJobPack, jobCircuit, jobPackData, listJobs, loadJob, saveAsWired, saveCommissioning } from './service';

/**
 * Everyone who fits or prices a job reads it and records what was done on site; nobody here
 * sees a price (the presenters send none). Estimates themselves stay with owners and estimators.
 */
const jobCrew = allowRoles('owner', 'estimator', 'installer');

export function jobsRouter(_deps: ModuleDeps, registry: RegisteredRoute[]) {
  return moduleRouter('/api/jobs', registry, [
    route({
      method: 'get',
      path: '/',
      summary: "The firm's approved jobs (approved, deposit paid or won), without prices",
      policy: jobCrew,
      handler: async ({ res, em, auth }) => {
        const body: JobListResponse = { jobs: await listJobs(em, auth.organizationId) };
        res.json(body);
      },
    }),
    route({
      method: 'get',
      path: '/:id',
      summary: "A job's installer's pack: pick list, circuits, schedules, as-wired records and commissioning readings",
      policy: jobCrew,
      schemas: { params: JobParams },
      handler: async ({ res, em, input, auth }) => {
        const quote = await loadJob(em, auth.organizationId, input.params.id);
        res.json(await buildJobPack(em, quote));
      },
    }),
    route({
      method: 'get',
      path: '/:id/pack.pdf',
      summary: "The installer's pack as a PDF (rendered in the PDF worker), without prices",
      policy: jobCrew,
      schemas: { params: JobParams },
      handler: async ({ res, em, input, auth }) => {
        const quote = await loadJob(em, auth.organizationId, input.params.id);
        const { pack, evaluations } = await jobPackData(em, quote);
        const pdf = await sharedPdfRenderer().renderInstallerPack(buildInstallerPackPdfModel(pack, quote, evaluations));
        res.setHeader('Content-Disposition', `attachment; filename="${installerPackFileName(pack.job.reference)}"`);
        res.type('application/pdf').send(pdf);
      },
    }),
    route({
      method: 'put',
      path: '/:id/circuits/:circuitId/as-wired',
      summary: 'Record what was connected on site for a circuit; the wiring check says whether it is safe and what to change',
      policy: jobCrew,
      schemas: { params: JobCircuitParams },
      handler: async ({ req, res, em, input, auth }) => {
        const quote = await loadJob(em, auth.organizationId, input.params.id);
        await jobCircuit(em, quote, input.params.circuitId);
        const request = validatedBody(req, SaveAsWiredRequest);
        const body: SaveAsWiredResponse = {
          asWired: await saveAsWired(em, quote, input.params.circuitId, request, auth.user.id),
        };
        res.json(body);
      },
    }),
    route({
      method: 'put',
      path: '/:id/circuits/:circuitId/commissioning',
      summary: "Save a circuit's commissioning readings and checks; readings outside the expected range are flagged",
      policy: jobCrew,
      schemas: { params: JobCircuitParams },
      handler: async ({ req, res, em, input, auth }) => {
        const quote = await loadJob(em, auth.organizationId, input.params.id);
        await jobCircuit(em, quote, input.params.circuitId);
        const request = validatedBody(req, SaveCommissioningRequest);
        const body: SaveCommissioningResponse = {
          commissioning: await saveCommissioning(em, quote, input.params.circuitId, request, auth.user.id),
        };
        res.json(body);
      },
    }),
  ]);
}
