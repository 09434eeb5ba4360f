/** The app's one query client and its defaults (src/App.tsx makes it; tests can make their own the same way). */
import { QueryClient } from '@tanstack/react-query';
import { ApiError } from './api/client';

const MAX_RETRIES = 3;

/**
 * A 4xx answer is the server's final word (gone, expired, not allowed, signed out): asking again only
 * keeps the page on "Loading…". A lost connection or a 5xx may pass, so those are tried a few more times.
 */
export function retryUnlessAnswered(failureCount: number, error: unknown): boolean {
  if (error instanceof ApiError && error.status >= 400 && error.status < 500) return false;
  return failureCount < MAX_RETRIES;
}

export function makeQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: { queries: { staleTime: 30_000, refetchOnWindowFocus: false, retry: retryUnlessAnswered } },
  });
}
