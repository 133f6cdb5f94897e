import { queryOptions, useQuery } from '@tanstack/react-query';
import { takeEarlyQuote } from './early-quote';
import { fetchQuote } from './fetch-quote';
import { quoteKeys } from './quote-keys';

export const quoteQueryOptions = (token: string) =>
  queryOptions({ queryKey: quoteKeys.view(token), queryFn: ({ signal }) => takeEarlyQuote(token) ?? fetchQuote(token, signal) });

export const useQuote = (token: string) => useQuery(quoteQueryOptions(token));
