import { useSearchParams } from 'react-router-dom';

/**
 * A list page's state (search, sort, filters, page) lives in the address bar so it survives a
 * reload and can be shared. `update` sets several parameters at once, dropping empty ones and
 * page 1, and replaces the history entry rather than adding one per keystroke.
 */
export function useListSearchParams(): [URLSearchParams, (changes: Record<string, string>) => void] {
  const [params, setParams] = useSearchParams();
  const update = (changes: Record<string, string>) => {
    const next = new URLSearchParams(params);
    for (const [key, value] of Object.entries(changes)) {
      if (value === '' || (key === 'page' && value === '1')) next.delete(key);
      else next.set(key, value);
    }
    setParams(next, { replace: true });
  };
  return [params, update];
}
