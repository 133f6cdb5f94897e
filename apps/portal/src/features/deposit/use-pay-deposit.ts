import { useState } from 'react';
import { isApiError } from '../../lib/api-error';
import { navigation, startDepositCheckout } from './deposit-api';

/** "Pay deposit": ask the api for a checkout and go to the provider's page. */
export function usePayDeposit(token: string) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const pay = async () => {
    setBusy(true);
    setError(null);
    try {
      const { url } = await startDepositCheckout(token);
      navigation.go(url);
    } catch (err) {
      setError(isApiError(err) ? err.detail : 'Something went wrong. Please try again.');
      setBusy(false);
    }
  };
  return { pay, busy, error };
}
