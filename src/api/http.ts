// The one way the client talks to the REST API: JSON in, JSON out, errors in the shape of docs/contracts.md §Errors.
import type { ApiErrorBody, ErrorCode } from '@shared/schema/errors.ts';

const TOKEN_KEY = 'stanchion.token';

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode | 'network',
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

export function getToken(): string | null {
  return localStorage.getItem(TOKEN_KEY);
}
export function setToken(token: string | null): void {
  if (token) localStorage.setItem(TOKEN_KEY, token);
  else localStorage.removeItem(TOKEN_KEY);
}

type UnauthorisedListener = () => void;
const unauthorisedListeners = new Set<UnauthorisedListener>();
/** Called on any 401 so the auth store can sign out; returns an unsubscribe function. */
export function onUnauthorised(listener: UnauthorisedListener): () => void {
  unauthorisedListeners.add(listener);
  return () => unauthorisedListeners.delete(listener);
}

/** Tells every listener the session is over (a 401, or the live channel saying so). */
export function notifyUnauthorised(): void {
  unauthorisedListeners.forEach((l) => l());
}

export async function apiFetch<T>(
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE',
  path: string,
  body?: unknown,
): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  const token = getToken();
  if (token) headers.Authorization = `Bearer ${token}`;
  let payload: BodyInit | undefined;
  if (body instanceof FormData) payload = body;
  else if (body !== undefined) {
    headers['Content-Type'] = 'application/json';
    payload = JSON.stringify(body);
  }
  let res: Response;
  try {
    res = await fetch(`/api${path}`, { method, headers, body: payload });
  } catch (e) {
    throw new ApiError(0, 'network', `Cannot reach the server (${(e as Error).message})`);
  }
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  const json: unknown = text ? safeParse(text) : undefined;
  if (!res.ok) {
    if (res.status === 401) notifyUnauthorised();
    const err = (json as ApiErrorBody | undefined)?.error;
    throw new ApiError(
      res.status,
      err?.code ?? 'internal',
      err?.message ?? `Request failed (${res.status})`,
      err?.details,
    );
  }
  return json as T;
}

/** The verbs the resource modules use; each answers the parsed JSON as unknown, for a shared schema to check. */
export const http = {
  get: (path: string): Promise<unknown> => apiFetch<unknown>('GET', path),
  post: (path: string, body?: unknown): Promise<unknown> => apiFetch<unknown>('POST', path, body),
  put: (path: string, body?: unknown): Promise<unknown> => apiFetch<unknown>('PUT', path, body),
  patch: (path: string, body?: unknown): Promise<unknown> => apiFetch<unknown>('PATCH', path, body),
  delete: async (path: string): Promise<void> => {
    await apiFetch<unknown>('DELETE', path);
  },
};

/** A path segment from an id or a key typed by a person. */
export const seg = (part: string | number): string => encodeURIComponent(part);

function safeParse(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    // A non-JSON body (a proxy's error page, say) is reported by status, not parsed.
    return undefined;
  }
}
