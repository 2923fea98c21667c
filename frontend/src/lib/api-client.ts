import { DOMAIN_ERRORS, type ApiErrorBody, type DomainErrorCode } from '@amberline/common';

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
  /** Why the desk refused, in the domain's terms (`version_conflict`, `run_sheet_changed`, …); absent for other errors. */
  get code(): DomainErrorCode | undefined {
    return this.body.code;
  }
  fieldErrors(): { name: string; errors: string[] }[] {
    return Array.isArray(this.body.details) ? this.body.details.map((d) => ({ name: d.field, errors: [d.reason] })) : [];
  }
}

let onUnauthorized: () => void = () => {};
export const setUnauthorizedHandler = (fn: () => void) => {
  onUnauthorized = fn;
};

/** Whether the service answered 503 (database or server unavailable) on the last call; the session is kept. */
type Availability = (unavailable: boolean) => void;
const availabilityListeners = new Set<Availability>();
export const onAvailability = (fn: Availability): (() => void) => {
  availabilityListeners.add(fn);
  return () => availabilityListeners.delete(fn);
};
const announce = (unavailable: boolean) => availabilityListeners.forEach((fn) => fn(unavailable));

export async function api<T>(path: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const headers = new Headers(init.headers);
  const token = tokenStore.get();
  if (token) headers.set('authorization', `Bearer ${token}`);
  let body = init.body;
  if (init.json !== undefined) {
    headers.set('content-type', 'application/json');
    body = JSON.stringify(init.json);
  }
  let res: Response;
  try {
    res = await fetch(`/api${path}`, { ...init, headers, body });
  } catch {
    announce(true);
    throw new ApiError(503, { statusCode: 503, error: 'service_unavailable', message: 'The service cannot be reached; check the connection and try again' });
  }
  announce(res.status === 503 || res.status === 502 || res.status === 504);
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  let data: unknown;
  try {
    data = text ? JSON.parse(text) : undefined;
  } catch {
    data = undefined; // a proxy's HTML error page, say
  }
  if (!res.ok) {
    const err = new ApiError(res.status, (data as ApiErrorBody | undefined) ?? { statusCode: res.status, error: 'internal_error', message: res.statusText || `HTTP ${res.status}` });
    // only a real 401 ends the session; an outage (503) keeps it
    // after this call settles (signing out clears the query cache, which must not happen under a running query)
    if (res.status === 401 && token) setTimeout(onUnauthorized, 0);
    throw err;
  }
  return data as T;
}

/**
 * Someone else saved the record after it was read. By its code; a server that does not send codes yet says it with
 * a 409 carrying the record's current version.
 */
export function isVersionConflict(e: unknown): boolean {
  if (!(e instanceof ApiError)) return false;
  if (e.code !== undefined) return e.code === DOMAIN_ERRORS.VERSION_CONFLICT;
  const details = e.body.details as { currentVersion?: unknown } | undefined;
  return e.status === 409 && !Array.isArray(details) && details?.currentVersion !== undefined;
}

/** The run sheet changed after it was opened. By its code; without codes, a 409 with no details. */
export function isRunSheetChanged(e: unknown): boolean {
  if (!(e instanceof ApiError)) return false;
  if (e.code !== undefined) return e.code === DOMAIN_ERRORS.RUN_SHEET_CHANGED;
  return e.status === 409 && e.body.details === undefined;
}
