import { useCallback, useEffect, useRef, useState } from 'react';

export type ApiAction<TInput, TResult> = {
  /** Sends the call. `onDone` runs only if this is still the latest call when its answer arrives. */
  run: (input: TInput, onDone?: (result: TResult) => void) => void;
  /** The latest call is on its way. */
  isPending: boolean;
  /** The latest call's failure (an ApiError for anything the api or the network did); cleared by the next call. */
  error: unknown;
  isError: boolean;
};

/**
 * A form's call to the api: its pending state and its last error, with the answer handed to
 * `onSuccess` (every successful call) and to the caller's `onDone` (the latest call only, so a
 * slow answer to an earlier choice never overwrites a newer one). `run` keeps one identity for
 * the component's life, so effects may depend on it.
 */
export function useApiAction<TInput, TResult>(
  call: (input: TInput) => Promise<TResult>,
  onSuccess?: (result: TResult) => void,
): ApiAction<TInput, TResult> {
  const latest = useRef({ call, onSuccess });
  const sequence = useRef(0);
  const mounted = useRef(false);
  const [state, setState] = useState<{ isPending: boolean; error: unknown }>({ isPending: false, error: null });

  useEffect(() => {
    latest.current = { call, onSuccess };
  });
  useEffect(() => {
    mounted.current = true;
    return () => {
      mounted.current = false;
    };
  }, []);

  const run = useCallback((input: TInput, onDone?: (result: TResult) => void) => {
    const id = ++sequence.current;
    setState({ isPending: true, error: null });
    latest.current.call(input).then(
      (result) => {
        if (!mounted.current) return;
        latest.current.onSuccess?.(result);
        if (id !== sequence.current) return;
        setState({ isPending: false, error: null });
        onDone?.(result);
      },
      (error: unknown) => {
        if (mounted.current && id === sequence.current) setState({ isPending: false, error });
      },
    );
  }, []);

  return { run, isPending: state.isPending, error: state.error, isError: state.error !== null };
}
