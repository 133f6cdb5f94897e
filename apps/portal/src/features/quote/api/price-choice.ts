import type { PortalTotalsResponse, PortalSelection } from '@gloaming/contracts';
import { answerWith, apiRequest } from '../../../lib/http-client';
import { useApiAction } from '../../../lib/use-api-action';
import { portalPath } from './fetch-quote';

/** The server's totals for a choice: the figures that count. */
export const priceChoice = (token: string, selection: PortalSelection) =>
  apiRequest(`${portalPath(token)}/totals`, {
    method: 'POST',
    body: { selection },
    schema: answerWith<PortalTotalsResponse>('totals'),
  });

export const usePriceChoice = (token: string) => useApiAction((selection: PortalSelection) => priceChoice(token, selection));
