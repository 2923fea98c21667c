import { randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { MOVE_STAGES, type Role } from '@amberline/common';
import type { OpenAPIObject } from '@nestjs/swagger';
import type { OperationObject, ParameterObject, ReferenceObject, SchemaObject } from '@nestjs/swagger/dist/interfaces/open-api-spec.interface';
import { buildOpenApiDocument } from '../src/openapi';
import { createServedTestApp, nextIp, type TestApp } from './utils/create-test-app';

/**
 * The API description (served at /api/docs) names every request body's fields and every query parameter; and a
 * fuzz pass built from it alone sends well over 1,000 bad requests across every route, as every role and as nobody,
 * against the served app (as `npm start` runs it): none answers 5xx, and every 400 names the field it was about.
 */
type Schema = SchemaObject | ReferenceObject;
type Operation = { method: 'get' | 'post' | 'put' | 'patch' | 'delete'; path: string; op: OperationObject };
type Caller = Role | 'nobody';
/** One bad request: where the bad value goes and the field the answer must name. */
type Case = { op: Operation; field: string; path: string; query?: string; body?: unknown; rawBody?: string };

const METHODS = ['get', 'post', 'put', 'patch', 'delete'] as const;
const CALLERS: Caller[] = ['admin', 'dispatcher', 'permit_clerk', 'driver', 'nobody'];

function operations(doc: OpenAPIObject): Operation[] {
  const out: Operation[] = [];
  for (const [path, item] of Object.entries(doc.paths)) for (const method of METHODS) if (item[method]) out.push({ method, path, op: item[method] as OperationObject });
  return out;
}

const resolve = (doc: OpenAPIObject, s: Schema | undefined): SchemaObject | undefined =>
  s && '$ref' in s && s.$ref ? (doc.components?.schemas?.[s.$ref.split('/').pop() as string] as SchemaObject) : (s as SchemaObject | undefined);

const jsonBodySchema = (doc: OpenAPIObject, op: OperationObject): SchemaObject | undefined => {
  const body = op.requestBody && 'content' in op.requestBody ? op.requestBody.content['application/json'] : undefined;
  return resolve(doc, body?.schema);
};

/** Values no field of this schema accepts, whatever else the request holds (so the answer must name it). */
function badValues(doc: OpenAPIObject, s: Schema, required: boolean): unknown[] {
  const r = resolve(doc, s) ?? {};
  const isRef = '$ref' in s || r.properties !== undefined;
  const type = isRef ? 'object' : r.type ?? (r.enum ? 'string' : undefined);
  const out: unknown[] = required ? [null] : [];
  switch (type) {
    case 'string':
      return [...out, 12345, 'NUL\u0000inside', ['a'], { a: 1 }];
    case 'number':
    case 'integer':
      return [...out, 'twelve', true, [1], { n: 1 }];
    case 'boolean':
      return [...out, 'yes', 1, [true]];
    case 'array':
      return [...out, { a: 1 }, 'x', 7];
    case 'object':
      return [...out, [], 'x', 7, true];
    default:
      return out;
  }
}

/** The path with every parameter filled by a value it accepts (a UUID, a state code, a token's length). */
function fillPath(op: Operation, bad?: { name: string; value: string }): string {
  return op.path.replace(/\{(\w+)\}/g, (_, name: string) => {
    if (bad?.name === name) return bad.value;
    const param = (op.op.parameters ?? []).find((p): p is ParameterObject => 'name' in p && p.name === name);
    const format = param?.schema && 'format' in param.schema ? param.schema.format : undefined;
    if (format === 'uuid') return randomUUID();
    if (name === 'code') return 'TX';
    if (name === 'token') return 'A'.repeat(43);
    return 'x';
  });
}

function casesFor(doc: OpenAPIObject, op: Operation): Case[] {
  // a route that first checks a required header (the processor's signature) must name the header, whatever the body
  const header = (op.op.parameters ?? []).find((p): p is ParameterObject => 'name' in p && p.in === 'header' && p.required === true);
  // (a body the JSON parser refuses is answered before any route: it names the body)
  if (header) return casesWithout(doc, op).map((c) => (c.field === 'body' && c.rawBody?.startsWith('{"unterminated"') ? c : { ...c, field: header.name }));
  return casesWithout(doc, op);
}

function casesWithout(doc: OpenAPIObject, op: Operation): Case[] {
  const cases: Case[] = [];
  const path = fillPath(op);
  const schema = jsonBodySchema(doc, op.op);
  if (schema?.properties) {
    const required = new Set(schema.required ?? []);
    for (const [name, prop] of Object.entries(schema.properties)) {
      for (const value of badValues(doc, prop, required.has(name))) cases.push({ op, path, field: name, body: { [name]: value } });
      // one level down: each field of a nested object, or of the first item of a nested list
      const inner = resolve(doc, prop);
      const item = inner?.type === 'array' ? resolve(doc, inner.items as Schema) : inner;
      if (!item?.properties) continue;
      const innerRequired = new Set(item.required ?? []);
      for (const [sub, subProp] of Object.entries(item.properties)) {
        for (const value of badValues(doc, subProp, innerRequired.has(sub)).slice(0, 2)) {
          const nested = { [sub]: value };
          cases.push(inner?.type === 'array' ? { op, path, field: `${name}[0].${sub}`, body: { [name]: [nested] } } : { op, path, field: `${name}.${sub}`, body: { [name]: nested } });
        }
      }
    }
    cases.push({ op, path, field: 'noSuchField', body: { noSuchField: 1 } });
    cases.push({ op, path, field: 'body', rawBody: '[]' });
    cases.push({ op, path, field: 'a', rawBody: '{"a":'.repeat(100) + '1' + '}'.repeat(100) });
    cases.push({ op, path, field: 'body', rawBody: '{"unterminated": ' });
  }
  // a bad id or query beside an empty body: the answer must name the parameter (the body's own faults may come too)
  const body = op.op.requestBody ? {} : undefined;
  for (const p of (op.op.parameters ?? []).filter((x): x is ParameterObject => 'name' in x)) {
    const s = resolve(doc, p.schema) ?? {};
    if (p.in === 'path') {
      const values = s.format === 'uuid' ? ['not-a-uuid', '-'.repeat(36), '%00', 'A'.repeat(300)] : ['%00'];
      for (const value of values) cases.push({ op, field: p.name, path: fillPath(op, { name: p.name, value }), body });
    }
    if (p.in === 'query') {
      const values =
        s.type === 'integer' ? ['abc', '1e20', '0', '1.5', '99999999999999999999'] : s.enum ? ['no-such-value', '%00'] : s.type === 'boolean' ? ['maybe', '%00'] : ['%00', `${'x'.repeat(300)}%00`];
      for (const value of values) cases.push({ op, path, field: p.name, query: `${p.name}=${value}`, body });
    }
  }
  return cases;
}

describe('the API description', () => {
  let t: TestApp;
  let doc: OpenAPIObject;
  const tokens = {} as Record<Role, string>;
  beforeAll(async () => {
    if (!existsSync(join(__dirname, '..', '..', 'frontend', 'dist', 'index.html'))) throw new Error('the front end is not built (npm test builds it)');
    t = await createServedTestApp();
    doc = buildOpenApiDocument(t.app);
    const users = await t.signedInAll();
    for (const role of Object.keys(users) as Role[]) tokens[role] = users[role].token;
  });
  afterAll(() => t.close());

  it('describes every request body by its fields, and every query parameter, as the validation checks them', () => {
    const ops = operations(doc);
    expect(ops.length).toBeGreaterThanOrEqual(60);
    const withBody = ops.filter((o) => o.op.requestBody);
    expect(withBody.length).toBeGreaterThanOrEqual(25);
    for (const o of withBody) {
      const content = o.op.requestBody && 'content' in o.op.requestBody ? o.op.requestBody.content : {};
      const [type] = Object.keys(content);
      const schema = resolve(doc, content[type].schema);
      expect({ route: `${o.method} ${o.path}`, fields: Object.keys(schema?.properties ?? {}).length > 0 }).toEqual({ route: `${o.method} ${o.path}`, fields: true });
    }
    // the nested parts are described too, and each field says what it takes
    const move = resolve(doc, { $ref: '#/components/schemas/CreateMoveDto' }) as SchemaObject;
    expect(move.required).toEqual(expect.arrayContaining(['customer', 'articles', 'route', 'requestedDeparture']));
    expect(move.properties?.requestedDeparture).toMatchObject({ type: 'string', format: 'date' });
    const article = resolve(doc, (resolve(doc, move.properties?.articles) as SchemaObject).items as Schema) as SchemaObject;
    expect(article.properties?.weightLb).toMatchObject({ type: 'number', minimum: 1, maximum: 1_000_000 });
    expect(resolve(doc, { $ref: '#/components/schemas/PreviewDto' })?.properties?.customer).toBeDefined();
    // the upload takes one PDF as multipart form data
    const upload = ops.find((o) => o.method === 'post' && o.path === '/api/permits/{id}/documents');
    expect(upload?.op.requestBody && 'content' in upload.op.requestBody ? Object.keys(upload.op.requestBody.content) : []).toEqual(['multipart/form-data']);

    const query = (path: string, method: Operation['method'] = 'get') =>
      Object.fromEntries(
        (ops.find((o) => o.path === path && o.method === method)?.op.parameters ?? []).filter((p): p is ParameterObject => 'name' in p && p.in === 'query').map((p) => [p.name, p.schema]),
      );
    const moves = query('/api/moves');
    expect(Object.keys(moves).sort()).toEqual(['jurisdiction', 'page', 'pageSize', 'search', 'sort', 'stage']);
    expect(moves.stage).toMatchObject({ enum: [...MOVE_STAGES] });
    expect(moves.page).toMatchObject({ type: 'integer', minimum: 1 });
    expect(Object.keys(query('/api/permits'))).toEqual(expect.arrayContaining(['status', 'assignee', 'moveId', 'page']));
    expect(query('/api/fleet/tractors/{id}', 'put').version).toMatchObject({ type: 'integer', minimum: 1 });
    // every list that takes a query says so
    for (const path of ['/api/users', '/api/payments', '/api/mail/outbox', '/api/vendors']) expect(Object.keys(query(path)).length).toBeGreaterThan(0);
    // ids in paths are UUIDs
    const move1 = ops.find((o) => o.path === '/api/moves/{id}' && o.method === 'get');
    expect(move1?.op.parameters).toEqual([expect.objectContaining({ name: 'id', in: 'path', schema: { type: 'string', format: 'uuid' } })]);
  });

  it('fuzz: over 1,000 bad requests from the description, every route, every role — no 5xx, and each 400 names its field', async () => {
    const ops = operations(doc);
    const cases = ops.flatMap((o) => casesFor(doc, o));
    const failures: string[] = [];
    const named = new Set<string>(); // operations where some caller got past the role check to the field's check
    let sent = 0;
    for (const c of cases) {
      for (const caller of CALLERS) {
        const url = c.query ? `${c.path}?${c.query}` : c.path;
        let req = t.http()[c.op.method](url).set('x-forwarded-for', nextIp());
        if (caller !== 'nobody') req = req.set('authorization', `Bearer ${tokens[caller]}`);
        if (c.rawBody !== undefined) req = req.set('content-type', 'application/json').send(c.rawBody);
        else if (c.body !== undefined) req = req.send(c.body as object);
        const res = await req;
        sent += 1;
        const what = `${caller} ${c.op.method.toUpperCase()} ${url.slice(0, 120)} ${c.rawBody?.slice(0, 40) ?? JSON.stringify(c.body ?? null).slice(0, 80)}`;
        if (res.status >= 500) failures.push(`${res.status} ${what}`);
        if (res.status !== 400) continue;
        const details: { field: string; reason: string }[] = Array.isArray(res.body.details) ? res.body.details : [];
        const names = details.some((d) => d.field === c.field && d.reason.length > 0) && typeof res.body.message === 'string' && res.body.message.includes(c.field);
        if (!names) failures.push(`400 without naming ${c.field}: ${what} → ${JSON.stringify(res.body).slice(0, 200)}`);
        else named.add(`${c.op.method} ${c.op.path}`);
      }
    }
    const kinds = [...new Map(failures.map((f) => [f.replace(/^\S+ (\S+ )?\S+ /, '').slice(0, 60), f])).values()];
    expect({ count: failures.length, first: kinds.slice(0, 15) }).toEqual({ count: 0, first: [] });
    expect(sent).toBeGreaterThanOrEqual(1000);
    // every route that takes a body, a query or an id was exercised past its role check
    const checkable = ops.filter((o) => (o.op.requestBody && jsonBodySchema(doc, o.op)) || (o.op.parameters ?? []).length > 0).map((o) => `${o.method} ${o.path}`);
    expect(checkable.filter((k) => !named.has(k))).toEqual([]);
  }, 600_000);
});
