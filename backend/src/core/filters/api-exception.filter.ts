import { ArgumentsHost, Catch, ExceptionFilter, HttpException, HttpStatus, Logger } from '@nestjs/common';
import type { Response } from 'express';
import { QueryFailedError } from 'typeorm';
import { ERROR_CODES, type ApiErrorBody, type ErrorCode } from '@amberline/common';
import { AppException } from '../app-exception';

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

/** The one place errors become JSON: `{ statusCode, error, message, details? }`, never a stack trace. */
@Catch()
export class ApiExceptionFilter implements ExceptionFilter {
  private readonly logger = new Logger('Errors');

  catch(exception: unknown, host: ArgumentsHost): void {
    const res = host.switchToHttp().getResponse<Response>();
    const body = this.toBody(exception);
    if (body.statusCode >= 500) {
      this.logger.error(exception instanceof Error ? exception.stack ?? exception.message : String(exception));
    }
    if (!res.headersSent) res.status(body.statusCode).json(body);
  }

  private toBody(exception: unknown): ApiErrorBody {
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
    // body-parser errors (malformed JSON, too large) carry their own status
    const e = exception as { status?: number; type?: string; message?: string };
    if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) {
      const message = e.type === 'entity.parse.failed' ? 'body: malformed JSON' : e.message ?? 'Bad request';
      return { statusCode: e.status, error: CODE_BY_STATUS[e.status] ?? ERROR_CODES.BAD_REQUEST, message };
    }
    if (exception instanceof QueryFailedError) {
      const code = (exception as unknown as { driverError?: { code?: string; detail?: string } }).driverError?.code;
      if (code === '23505') return { statusCode: 409, error: ERROR_CODES.CONFLICT, message: 'A record with these values already exists' };
      if (code === '22P02' || code === '22003' || code === '22001') {
        return { statusCode: 400, error: ERROR_CODES.BAD_REQUEST, message: 'A value has the wrong format or is out of range' };
      }
      if (code === '40001' || code === '40P01') return { statusCode: 409, error: ERROR_CODES.CONFLICT, message: 'Concurrent change, try again' };
    }
    return { statusCode: HttpStatus.INTERNAL_SERVER_ERROR, error: ERROR_CODES.INTERNAL, message: 'Internal server error' };
  }
}
