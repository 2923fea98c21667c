import type { ApiErrorBody } from '@amberline/common';

const TOKEN_KEY = 'amberline.token';

export const tokenStore = {
  get: () => localStorage.getItem(TOKEN_KEY),
  set: (t: string) => localStorage.setItem(TOKEN_KEY, t),
  clear: () => localStorage.removeItem(TOKEN_KEY),
};

/** An error the API answered with: status, stable code, message and per-field details. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly body: ApiErrorBody,
  ) {
    super(body.message);
  }
  fieldErrors(): { name: string; errors: string[] }[] {
    return Array.isArray(this.body.details) ? this.body.details.map((d) => ({ name: d.field, errors: [d.reason] })) : [];
  }
}

let onUnauthorized: () => void = () => {};
export const setUnauthorizedHandler = (fn: () => void) => {
  onUnauthorized = fn;
};

export async function api<T>(path: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const headers = new Headers(init.headers);
  const token = tokenStore.get();
  if (token) headers.set('authorization', `Bearer ${token}`);
  let body = init.body;
  if (init.json !== undefined) {
    headers.set('content-type', 'application/json');
    body = JSON.stringify(init.json);
  }
  const res = await fetch(`/api${path}`, { ...init, headers, body });
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  const data = text ? JSON.parse(text) : undefined;
  if (!res.ok) {
    const err = new ApiError(res.status, data ?? { statusCode: res.status, error: 'internal_error', message: res.statusText });
    if (res.status === 401 && token) onUnauthorized();
    throw err;
  }
  return data as T;
}
