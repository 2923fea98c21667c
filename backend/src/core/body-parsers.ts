import type { IncomingMessage } from 'node:http';
import { json, urlencoded, type RequestHandler } from 'express';

/** The bytes as received, on `req.rawBody` (the payment webhook checks its signature over them). */
const keepRawBody = (req: IncomingMessage & { rawBody?: Buffer }, _res: unknown, buf: Buffer): void => {
  if (Buffer.isBuffer(buf)) req.rawBody = buf;
};

/**
 * The JSON and form parsers, with the options Nest would give them (raw body kept, forms with nested fields).
 * configureApp registers them itself, ahead of the routes and followed by the answer to a body they refuse; they
 * keep the names Nest looks for (`jsonParser`, `urlencodedParser`), so Nest adds no second pair at start.
 */
export function bodyParsers(): RequestHandler[] {
  return [json({ verify: keepRawBody }), urlencoded({ extended: true, verify: keepRawBody })];
}
