import { useEffect, useId, useRef, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { useCreateQuote } from '../api/create-quote';
import { useCustomerSearch, useCustomerSites } from '../api/search-customers';

/**
 * Start a quote: find the customer by typing (arrows and Enter), pick the site, Enter again.
 * Customers themselves are added in the Customers screen.
 */
export function NewQuotePanel({ onClose }: { onClose: () => void }) {
  const [search, setSearch] = useState('');
  const [debounced, setDebounced] = useState('');
  const [active, setActive] = useState(0);
  const [customerId, setCustomerId] = useState<string | null>(null);
  const [siteId, setSiteId] = useState<string>('');
  const listId = useId();
  const inputRef = useRef<HTMLInputElement>(null);
  const siteRef = useRef<HTMLSelectElement>(null);
  const navigate = useNavigate();
  const create = useCreateQuote();
  useEffect(() => inputRef.current?.focus(), []);
  useEffect(() => {
    const t = window.setTimeout(() => setDebounced(search.trim()), 150);
    return () => window.clearTimeout(t);
  }, [search]);
  const customers = useCustomerSearch(debounced);
  const found = customers.data?.customers ?? [];
  const chosen = useCustomerSites(customerId);
  const sites = chosen.data?.customer.sites;
  const site = siteId || sites?.[0]?.id || '';
  useEffect(() => {
    if (sites && sites.length > 0) siteRef.current?.focus();
  }, [sites]);

  const choose = (id: string) => {
    setCustomerId(id);
    setSiteId('');
  };
  const start = () => {
    if (!customerId) return;
    create.mutate({ customerId, siteId: site || null }, { onSuccess: (detail) => navigate(`/quotes/${detail.quote.id}`) });
  };

  return (
    <section
      aria-labelledby="new-quote-title"
      className="mb-6 grid gap-4 rounded-card bg-surface p-5 shadow-card ring-1 ring-lamp-300"
      onKeyDown={(e) => {
        if (e.key === 'Escape') onClose();
      }}
    >
      <div className="flex items-center justify-between">
        <h2 id="new-quote-title" className="text-heading font-semibold text-ink">
          New quote
        </h2>
        <Button variant="quiet" className="h-8" onClick={onClose}>
          Close
        </Button>
      </div>
      <div className="grid gap-4 md:grid-cols-2">
        <div className="flex flex-col gap-1">
          <label htmlFor={`${listId}-input`} className="text-caption font-semibold text-ink">
            Customer
          </label>
          <input
            id={`${listId}-input`}
            ref={inputRef}
            role="combobox"
            aria-expanded={found.length > 0}
            aria-controls={listId}
            aria-activedescendant={found[active] ? `${listId}-${active}` : undefined}
            value={search}
            placeholder="Type a name"
            onChange={(e) => {
              setSearch(e.target.value);
              setActive(0);
              setCustomerId(null);
            }}
            onKeyDown={(e) => {
              if (e.key === 'ArrowDown') {
                e.preventDefault();
                setActive((a) => Math.min(a + 1, found.length - 1));
              } else if (e.key === 'ArrowUp') {
                e.preventDefault();
                setActive((a) => Math.max(0, a - 1));
              } else if (e.key === 'Enter') {
                e.preventDefault();
                const c = found[active];
                if (c) {
                  setSearch(c.name);
                  choose(c.id);
                }
              }
            }}
            className="h-10 rounded-control bg-surface px-3 text-body ring-1 ring-mist-300 outline-none focus:ring-2 focus:ring-focus"
          />
          <ul id={listId} role="listbox" aria-label="Matching customers" className="max-h-56 overflow-auto rounded-control ring-1 ring-line">
            {customers.isError ? (
              <li className="px-3 py-2 text-caption text-danger">{customers.error.message}</li>
            ) : found.length === 0 ? (
              <li className="px-3 py-2 text-caption text-ink-muted">{customers.isFetching ? 'Searching…' : 'No customer matches. Add them under Customers first.'}</li>
            ) : (
              found.map((c, i) => (
                <li
                  key={c.id}
                  id={`${listId}-${i}`}
                  role="option"
                  aria-selected={c.id === customerId || i === active}
                  onMouseDown={(e) => {
                    e.preventDefault();
                    setSearch(c.name);
                    choose(c.id);
                  }}
                  className={`flex justify-between px-3 py-1.5 text-caption ${i === active ? 'bg-lamp-50' : ''} ${c.id === customerId ? 'font-semibold' : ''}`}
                >
                  <span>{c.name}</span>
                  <span className="font-mono text-ink-muted">{c.firstPostcode}</span>
                </li>
              ))
            )}
          </ul>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${listId}-site`} className="text-caption font-semibold text-ink">
            Site
          </label>
          <select
            id={`${listId}-site`}
            ref={siteRef}
            disabled={!customerId || !sites || sites.length === 0}
            value={site}
            onChange={(e) => setSiteId(e.target.value)}
            onKeyDown={(e) => {
              if (e.key === 'Enter') {
                e.preventDefault();
                start();
              }
            }}
            className="h-10 rounded-control bg-surface px-3 text-body ring-1 ring-mist-300 disabled:bg-mist-100"
          >
            {!sites || sites.length === 0 ? <option value="">{customerId ? 'No sites' : 'Choose a customer first'}</option> : null}
            {(sites ?? []).map((s) => (
              <option key={s.id} value={s.id}>
                {[s.label, s.addressLines.split('\n')[0], s.postcode].filter(Boolean).join(' · ')}
              </option>
            ))}
          </select>
          <div className="mt-auto flex items-center gap-3 pt-3">
            <Button onClick={start} disabled={!customerId} busy={create.isPending}>
              Start quote
            </Button>
            {create.isError ? (
              <p role="alert" className="text-caption text-danger">
                {create.error.message}
              </p>
            ) : null}
          </div>
        </div>
      </div>
    </section>
  );
}
