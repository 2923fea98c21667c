import type { FieldError } from '@amberline/common';

/** Deepest nesting of arrays and objects a request may carry (the deepest the API takes, a rule record, is under 10). */
export const MAX_INPUT_DEPTH = 32;
/** Problems named at most, so a body full of them gets a short answer. */
const MAX_REPORTED = 20;

const NUL_REASON = 'must not contain the NUL character (\\u0000)';
const KEY_NUL_REASON = 'its name must not contain the NUL character (\\u0000)';
const DEPTH_REASON = `must not nest arrays and objects more than ${MAX_INPUT_DEPTH} levels deep`;

const isPlainObject = (v: object): boolean => {
  const proto = Object.getPrototypeOf(v);
  return proto === Object.prototype || proto === null;
};

/**
 * What no validator or database may be handed, found without recursion: nesting deeper than MAX_INPUT_DEPTH (the
 * validators recurse and would overflow the stack) and the NUL character in any string or property name (PostgreSQL
 * cannot store it). `root` names the value: the parameter's name, or '' for a whole body, query or set of path
 * parameters. Nesting too deep is reported once, on the top-level field that holds it; NUL on the field itself.
 */
export function unsafeInput(value: unknown, root: string): FieldError[] {
  const out: FieldError[] = [];
  const name = (path: string) => (!path ? 'body' : path.startsWith('[') ? `body${path}` : path);
  const stack: { v: unknown; path: string; top: string; depth: number }[] = [{ v: value, path: root, top: root, depth: 1 }];
  const tooDeep = new Set<string>();
  while (stack.length && out.length < MAX_REPORTED) {
    const { v, path, top, depth } = stack.pop()!;
    if (typeof v === 'string') {
      if (v.includes('\u0000')) out.push({ field: name(path), reason: NUL_REASON });
      continue;
    }
    if (v === null || typeof v !== 'object' || !(Array.isArray(v) || isPlainObject(v))) continue;
    if (depth > MAX_INPUT_DEPTH) {
      if (!tooDeep.has(top)) out.push({ field: name(top), reason: DEPTH_REASON });
      tooDeep.add(top);
      continue;
    }
    const children: { v: unknown; path: string; top: string; depth: number }[] = [];
    if (Array.isArray(v)) {
      v.forEach((x, i) => children.push({ v: x, path: `${path}[${i}]`, top, depth: depth + 1 }));
    } else {
      for (const [k, x] of Object.entries(v)) {
        const p = path ? `${path}.${k}` : k;
        if (k.includes('\u0000')) out.push({ field: name(p), reason: KEY_NUL_REASON });
        children.push({ v: x, path: p, top: top || k, depth: depth + 1 });
      }
    }
    // reversed onto the stack, so problems are named in the order of the input
    for (let i = children.length - 1; i >= 0; i--) stack.push(children[i]);
  }
  return out.slice(0, MAX_REPORTED);
}
