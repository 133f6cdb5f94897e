import type { Product } from '@gloaming/contracts';
import { formatMoney } from '@gloaming/engine';
import { PRODUCT_KIND_LABELS } from '@gloaming/contracts';
import { useEffect, useId, useRef, useState } from 'react';
import { useProductSearch } from '../api/search-products';

/**
 * Type-ahead over the catalogue for a grid line: type to search, arrows to choose, Enter to
 * take it, Escape to leave the line as it was.
 */
export function ProductPicker({
  initialSearch,
  top,
  currency,
  locale,
  onPick,
}: {
  initialSearch: string;
  top: number;
  currency: string;
  locale: string;
  onPick: (product: Product | null) => void;
}) {
  const [search, setSearch] = useState(initialSearch);
  const [debounced, setDebounced] = useState(initialSearch);
  const [active, setActive] = useState(0);
  const listId = useId();
  const inputRef = useRef<HTMLInputElement>(null);
  useEffect(() => inputRef.current?.focus(), []);
  useEffect(() => {
    const t = window.setTimeout(() => setDebounced(search.trim()), 150);
    return () => window.clearTimeout(t);
  }, [search]);
  const query = useProductSearch(debounced, true);
  const products = query.data?.products ?? [];
  const current = Math.min(active, Math.max(0, products.length - 1));

  return (
    <div
      className="absolute left-9 z-30 w-[30rem] overflow-hidden rounded-card bg-surface shadow-[0_18px_40px_-12px_rgb(18_26_58/0.45)] ring-1 ring-dusk-200"
      style={{ top: Math.max(8, top) }}
    >
      <div className="flex items-center gap-2 border-b border-line bg-dusk-900 px-3 py-2">
        <svg viewBox="0 0 16 16" className="size-4 text-lamp-300" aria-hidden="true">
          <circle cx="7" cy="7" r="4.5" fill="none" stroke="currentColor" strokeWidth="1.6" />
          <path d="m10.5 10.5 3 3" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
        </svg>
        <input
          ref={inputRef}
          role="combobox"
          aria-expanded="true"
          aria-controls={listId}
          aria-activedescendant={products[current] ? `${listId}-${current}` : undefined}
          aria-label="Search the catalogue"
          value={search}
          placeholder="Product name or supplier code"
          onChange={(e) => {
            setSearch(e.target.value);
            setActive(0);
          }}
          onBlur={() => onPick(null)}
          onKeyDown={(e) => {
            e.stopPropagation();
            if (e.key === 'ArrowDown') {
              e.preventDefault();
              setActive((a) => Math.min(a + 1, products.length - 1));
            } else if (e.key === 'ArrowUp') {
              e.preventDefault();
              setActive((a) => Math.max(a - 1, 0));
            } else if (e.key === 'Enter') {
              e.preventDefault();
              onPick(products[current] ?? null);
            } else if (e.key === 'Escape') {
              e.preventDefault();
              onPick(null);
            }
          }}
          className="h-8 flex-1 bg-transparent text-body text-white placeholder:text-dusk-300 outline-none"
        />
      </div>
      <ul id={listId} role="listbox" aria-label="Catalogue products" className="max-h-72 overflow-auto py-1">
        {query.isError ? (
          <li className="px-3 py-2 text-caption text-danger">The catalogue could not be searched: {query.error.message}</li>
        ) : products.length === 0 ? (
          <li className="px-3 py-2 text-caption text-ink-muted">{query.isFetching ? 'Searching…' : 'No active product matches.'}</li>
        ) : (
          products.map((p, i) => (
            <li
              key={p.id}
              id={`${listId}-${i}`}
              role="option"
              aria-selected={i === current}
              onMouseDown={(e) => {
                e.preventDefault();
                onPick(p);
              }}
              className={`grid cursor-default grid-cols-[1fr_auto] gap-x-3 px-3 py-1.5 ${i === current ? 'bg-lamp-50' : ''}`}
            >
              <span className="truncate text-caption font-semibold text-ink">{p.name}</span>
              <span className="text-right font-mono text-caption text-ink">{formatMoney(p.costMinor, currency, locale)}</span>
              <span className="truncate text-micro text-ink-muted">
                {PRODUCT_KIND_LABELS[p.kind]} · {p.supplier} · <span className="font-mono">{p.supplierCode}</span>
              </span>
              <span className="text-right text-micro text-ink-muted">cost / {p.unit}</span>
            </li>
          ))
        )}
      </ul>
    </div>
  );
}
