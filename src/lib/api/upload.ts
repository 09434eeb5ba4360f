import type { ApiErrorBody } from '../../../shared/protocol';
import { ApiError } from './client';

/** Sends one file as a form upload (field "file"), the way the import routes read it. */
export async function uploadFile<T>(path: string, file: File): Promise<T> {
  const form = new FormData();
  form.append('file', file, file.name);
  let res: Response;
  try {
    res = await fetch(`/api${path}`, { method: 'POST', credentials: 'same-origin', body: form });
  } catch {
    throw new ApiError(0, 'OFFLINE', 'Rackside cannot be reached. Check your connection and try again.');
  }
  const data = (await res.json().catch(() => null)) as (T & Partial<ApiErrorBody>) | null;
  if (!res.ok) {
    const error = data?.error;
    throw new ApiError(res.status, error?.code ?? 'SERVER_ERROR', error?.message ?? 'The file could not be sent. Please try again.', error?.fields);
  }
  return data as T;
}
