import { CircuitSuggestionsResponse, type CcCircuitDesign } from '@gloaming/contracts';
import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { circuitsPath } from './list-circuits';

/** POST /api/quotes/:id/revisions/:n/circuit-suggestions: drivers that fit, or a split. */
export function fetchCircuitSuggestions(
  quoteId: string,
  revisionNumber: number,
  design: CcCircuitDesign,
): Promise<CircuitSuggestionsResponse> {
  return apiRequest(`${circuitsPath(quoteId, revisionNumber)}/circuit-suggestions`, {
    method: 'POST',
    body: { design },
    schema: CircuitSuggestionsResponse,
  });
}

export function useCircuitSuggestions(quoteId: string, revisionNumber: number) {
  return useMutation({ mutationFn: (design: CcCircuitDesign) => fetchCircuitSuggestions(quoteId, revisionNumber, design) });
}
