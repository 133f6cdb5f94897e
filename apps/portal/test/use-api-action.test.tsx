import { act, cleanup, renderHook } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError } from '../src/lib/api-error';
import { useApiAction } from '../src/lib/use-api-action';

afterEach(cleanup);

/** A call whose answers the test hands out one by one, in any order. */
function deferredCalls() {
  const pending: Array<{ input: number; resolve: (v: string) => void; reject: (e: unknown) => void }> = [];
  const call = (input: number) => new Promise<string>((resolve, reject) => pending.push({ input, resolve, reject }));
  return { call, pending };
}

describe('useApiAction', () => {
  it('hands a slow earlier answer to onSuccess but never lets it overwrite the latest call', async () => {
    const { call, pending } = deferredCalls();
    const onSuccess = vi.fn();
    const { result } = renderHook(() => useApiAction(call, onSuccess));
    const done: string[] = [];
    act(() => result.current.run(1, (r) => done.push(r)));
    act(() => result.current.run(2, (r) => done.push(r)));
    expect(result.current.isPending).toBe(true);
    await act(async () => pending[1]!.resolve('second'));
    expect(result.current.isPending).toBe(false);
    await act(async () => pending[0]!.resolve('first'));
    expect(done).toEqual(['second']);
    expect(onSuccess.mock.calls.map((c) => c[0])).toEqual(['second', 'first']);
  });

  it('keeps the failure for the form to show, and the next call clears it', async () => {
    const { call, pending } = deferredCalls();
    const { result } = renderHook(() => useApiAction(call));
    const refusal = new ApiError({ status: 422, title: 'Check the form', detail: 'Type your full name to approve.' });
    act(() => result.current.run(1));
    await act(async () => pending[0]!.reject(refusal));
    expect(result.current.isError).toBe(true);
    expect(result.current.error).toBe(refusal);
    act(() => result.current.run(2));
    expect(result.current.error).toBeNull();
    expect(result.current.isPending).toBe(true);
  });

  it('keeps one run function for the life of the component, so effects can depend on it', () => {
    const { call } = deferredCalls();
    const { result, rerender } = renderHook(() => useApiAction(call));
    const first = result.current.run;
    rerender();
    expect(result.current.run).toBe(first);
  });
});
