import { ArgumentsHost, Catch, ExceptionFilter, HttpException, HttpStatus, Logger } from '@nestjs/common';
import type { ErrorRequestHandler, Response } from 'express';
import { QueryFailedError } from 'typeorm';
import { DomainError, ERROR_CODES, type ApiErrorBody, type ErrorCode } from '@amberline/common';
import { AppException } from '../app-exception';
import { DOMAIN_STATUS } from './domain-status';

const CODE_BY_STATUS: Record<number, ErrorCode> = {
  400: ERROR_CODES.BAD_REQUEST,
  401: ERROR_CODES.UNAUTHENTICATED,
  403: ERROR_CODES.FORBIDDEN,
  404: ERROR_CODES.NOT_FOUND,
  409: ERROR_CODES.CONFLICT,
  413: ERROR_CODES.PAYLOAD_TOO_LARGE,
  415: ERROR_CODES.UNSUPPORTED_MEDIA_TYPE,
  429: ERROR_CODES.TOO_MANY_REQUESTS,
  503: ERROR_CODES.SERVICE_UNAVAILABLE,
};

/** An error of the body parsers (http-errors): its status, its kind and what it knows of the refused body. */
type ParserError = { status?: number; type?: string; message?: string; body?: string; limit?: number; charset?: string; encoding?: string; code?: string };

const refusal = (statusCode: number, error: ErrorCode, field: string, reason: string): ApiErrorBody => ({
  statusCode, error, message: `${field}: ${reason}`, details: [{ field, reason }],
});

function isJsonPrimitive(text: string): boolean {
  try {
    const v: unknown = JSON.parse(text);
    return v === null || typeof v !== 'object';
  } catch {
    return false;
  }
}

/** The answer to a body the parsers refused, naming the part of the request at fault; null for other errors. */
function parserRefusal(e: ParserError): ApiErrorBody | null {
  switch (e.type) {
    case 'entity.parse.failed': {
      // only objects and arrays are taken: a bare string, number, true, false or null is JSON of the wrong type
      if (typeof e.body === 'string' && isJsonPrimitive(e.body)) return refusal(400, ERROR_CODES.VALIDATION_FAILED, 'body', 'must be a JSON object or array');
      return refusal(400, ERROR_CODES.VALIDATION_FAILED, 'body', `malformed JSON (${e.message ?? 'unreadable'})`);
    }
    case 'entity.too.large':
      return refusal(413, ERROR_CODES.PAYLOAD_TOO_LARGE, 'body', `must be at most ${Math.floor((e.limit ?? 0) / 1024)} kB`);
    case 'parameters.too.many':
      return refusal(413, ERROR_CODES.PAYLOAD_TOO_LARGE, 'body', 'has too many form fields');
    case 'querystring.parse.rangeError':
      return refusal(400, ERROR_CODES.VALIDATION_FAILED, 'body', 'nests form fields too deep');
    case 'charset.unsupported':
      return refusal(415, ERROR_CODES.UNSUPPORTED_MEDIA_TYPE, 'content-type', `charset ${e.charset ?? ''} is not supported; send UTF-8`);
    case 'encoding.unsupported':
      return refusal(415, ERROR_CODES.UNSUPPORTED_MEDIA_TYPE, 'content-encoding', `${e.encoding ?? ''} is not supported; send gzip, deflate, br or no content-encoding`);
    case 'request.aborted':
      return refusal(400, ERROR_CODES.VALIDATION_FAILED, 'body', 'was cut off before it all arrived');
    case 'request.size.invalid':
      return refusal(400, ERROR_CODES.VALIDATION_FAILED, 'body', 'does not match its content-length header');
  }
  // a stream that does not decompress as its content-encoding says (zlib's Z_DATA_ERROR, Z_BUF_ERROR, …)
  if (e.status === 400 && typeof e.code === 'string' && /^(Z_|ERR_BROTLI|ERR__?ZLIB)/.test(e.code)) {
    return refusal(400, ERROR_CODES.VALIDATION_FAILED, 'body', `cannot be decompressed as its content-encoding says (${e.message ?? e.code})`);
  }
  return null;
}

/** The JSON body of every error: `{ statusCode, error, message, details? }`, never a stack trace. */
export function errorBody(exception: unknown): ApiErrorBody {
  if (exception instanceof DomainError) {
    const { status, error } = DOMAIN_STATUS[exception.code];
    return { statusCode: status, error, code: exception.code, message: exception.message, details: exception.details };
  }
  if (exception instanceof AppException) {
    return { statusCode: exception.getStatus(), error: exception.code, message: exception.message, details: exception.details };
  }
  if (exception instanceof HttpException) {
    const status = exception.getStatus();
    const resp = exception.getResponse();
    let message = exception.message;
    if (typeof resp === 'object' && resp && 'message' in resp) {
      const m = (resp as { message: unknown }).message;
      message = Array.isArray(m) ? m.join('; ') : String(m);
    }
    if (status === 404 && /^Cannot (GET|POST|PUT|PATCH|DELETE)/.test(message)) message = 'No such route';
    if (status === 400 && /JSON/.test(message) && !(exception instanceof AppException)) message = `body: malformed JSON (${message})`;
    return { statusCode: status, error: CODE_BY_STATUS[status] ?? (status < 500 ? ERROR_CODES.BAD_REQUEST : ERROR_CODES.INTERNAL), message };
  }
  // body-parser errors (malformed JSON, too large, charset, encoding) carry their own status and kind
  const e = exception as ParserError;
  const refused = e && typeof e === 'object' ? parserRefusal(e) : null;
  if (refused) return refused;
  if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) {
    return { statusCode: e.status, error: CODE_BY_STATUS[e.status] ?? ERROR_CODES.BAD_REQUEST, message: e.message ?? 'Bad request' };
  }
  if (exception instanceof QueryFailedError) {
    const code = (exception as unknown as { driverError?: { code?: string; detail?: string } }).driverError?.code;
    if (code === '23505') return { statusCode: 409, error: ERROR_CODES.CONFLICT, message: 'A record with these values already exists' };
    if (code === '22P02' || code === '22003' || code === '22001') {
      return { statusCode: 400, error: ERROR_CODES.BAD_REQUEST, message: 'A value has the wrong format or is out of range' };
    }
    if (code === '40001' || code === '40P01') return { statusCode: 409, error: ERROR_CODES.CONFLICT, message: 'Concurrent change, try again' };
  }
  if (isDatabaseUnavailable(exception)) {
    return { statusCode: 503, error: ERROR_CODES.SERVICE_UNAVAILABLE, message: 'The service is unavailable for the moment (the database cannot be reached); try again shortly' };
  }
  return { statusCode: HttpStatus.INTERNAL_SERVER_ERROR, error: ERROR_CODES.INTERNAL, message: 'Internal server error' };
}

/**
 * The database cannot be reached: refused or reset connections, a server shutting down or not accepting
 * connections (PostgreSQL classes 08 and 57P), a pool that timed out or was closed.
 */
function isDatabaseUnavailable(e: unknown): boolean {
  const err = e as { code?: string; driverError?: { code?: string }; message?: string } | null;
  const code = err?.driverError?.code ?? err?.code;
  if (code && (/^(ECONNREFUSED|ECONNRESET|ETIMEDOUT|EPIPE|ENOTFOUND|EAI_AGAIN)$/.test(code) || /^(08|57P)/.test(code))) return true;
  return /Connection terminated|connection timeout|timeout exceeded when trying to connect|Cannot use a pool after calling end|Driver not Connected/i.test(err?.message ?? '');
}

const logger = new Logger('Errors');

/** Answers `exception` with its JSON error body (5xx logged with the stack, never sent). */
export function sendError(res: Response, exception: unknown): void {
  const body = errorBody(exception);
  if (body.statusCode >= 500) logger.error(exception instanceof Error ? exception.stack ?? exception.message : String(exception));
  if (res.headersSent) return;
  if (exception instanceof AppException && exception.headers) res.set(exception.headers);
  if (body.statusCode === 503 && !res.getHeader('Retry-After')) res.setHeader('Retry-After', '30');
  res.status(body.statusCode).json(body);
}

/**
 * The same answer for an error raised by Express middleware before any route (the body parsers): registered right
 * after them, so no later handler (the front end's static files answer any error under /api with 404) sees it.
 */
export const answerMiddlewareError: ErrorRequestHandler = (err, _req, res, _next) => sendError(res, err);

/** The one place errors become JSON: `{ statusCode, error, message, details? }`, never a stack trace. */
@Catch()
export class ApiExceptionFilter implements ExceptionFilter {
  catch(exception: unknown, host: ArgumentsHost): void {
    sendError(host.switchToHttp().getResponse<Response>(), exception);
  }
}
