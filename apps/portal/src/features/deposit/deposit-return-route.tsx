import { useParams, useSearchParams } from 'react-router-dom';
import { DepositReturnPage } from './deposit-return-page';

/** /portal/q/:token/deposit/return?session_id=cs_…: where the payment page sends the homeowner. */
export function DepositReturnRoute() {
  const { token = '' } = useParams();
  const [search] = useSearchParams();
  return <DepositReturnPage token={token} sessionId={search.get('session_id')} quoteHref={`/portal/q/${encodeURIComponent(token)}`} />;
}
