import type { ApiErrorBody } from '../../../shared/protocol';
import { sessionEnded } from '../session-end';

/** Where a 401 is the ordinary answer to a wrong password, not news that a session ended. */
const SIGNING_IN = ['/auth/login', '/auth/register'];

/** An error from our API, with its stable code and any field errors. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
  }
}

export async function api<T>(path: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  let res: Response;
  try {
    res = await fetch(`/api${path}`, {
      method: init.method ?? 'GET',
      credentials: 'same-origin',
      headers: init.body === undefined ? {} : { 'Content-Type': 'application/json' },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
    });
  } catch {
    throw new ApiError(0, 'OFFLINE', 'Rackside cannot be reached. Check your connection and try again.');
  }
  const data = (await res.json().catch(() => null)) as (T & Partial<ApiErrorBody>) | null;
  if (!res.ok) {
    const error = data?.error;
    // The session is gone (signed out in another tab, or it ran out): the layout decides what to say.
    if (res.status === 401 && error?.code === 'UNAUTHENTICATED' && !SIGNING_IN.includes(path)) sessionEnded();
    throw new ApiError(res.status, error?.code ?? 'SERVER_ERROR', error?.message ?? 'Something went wrong. Please try again.', error?.fields);
  }
  return data as T;
}
