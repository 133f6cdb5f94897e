import { SaveRevisionResponse, type SaveRevisionRequest } from '@gloaming/contracts';
import { apiRequest } from '../../../lib/http-client';

/** PUT /api/quotes/:id/revisions/:n: the whole estimate with the version it was based on (409 when stale). */
export async function saveRevision(quoteId: string, revisionNumber: number, request: SaveRevisionRequest): Promise<SaveRevisionResponse> {
  return apiRequest(`/quotes/${encodeURIComponent(quoteId)}/revisions/${revisionNumber}`, { method: 'PUT', body: request, schema: SaveRevisionResponse });
}
