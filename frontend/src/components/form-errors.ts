import type { FormInstance } from 'antd';
import { ApiError } from '../lib/api-client';

/** `decks[0].heightIn` → ['decks', 0, 'heightIn']. */
export function apiFieldPath(apiField: string): (string | number)[] {
  const parts: (string | number)[] = [];
  for (const m of apiField.matchAll(/([^.[\]]+)|\[(\d+)\]/g)) parts.push(m[2] !== undefined ? Number(m[2]) : m[1]);
  return parts;
}

/**
 * Puts the API's per-field reasons on the form's fields. Returns the reasons no field of the form shows
 * (to be listed beside the form), or null when the error carried no field details.
 */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export function applyApiFieldErrors(form: FormInstance<any>, e: unknown, toPath: (field: string) => (string | number)[] = apiFieldPath): string[] | null {
  if (!(e instanceof ApiError)) return null;
  const fields = e.fieldErrors();
  if (fields.length === 0) return null;
  const registered = new Set(form.getFieldsError().map((f) => JSON.stringify(f.name)));
  const placed: { name: (string | number)[]; errors: string[] }[] = [];
  const unplaced: string[] = [];
  for (const f of fields) {
    const name = toPath(f.name);
    if (registered.has(JSON.stringify(name))) placed.push({ name, errors: f.errors });
    else unplaced.push(`${f.name}: ${f.errors.join(', ')}`);
  }
  form.setFields(placed as never);
  return unplaced;
}
