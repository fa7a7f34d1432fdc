import { ArgumentsHost, Catch, HttpException, HttpStatus, Logger, type ExceptionFilter } from '@nestjs/common';
import { STATUS_CODES } from 'node:http';
import type { Response } from 'express';
import type { ErrorBody } from '@beamwright/link-core/contracts';

/**
 * Shapes every error as `{ statusCode, error, message, issues? }` (plus extra fields a route
 * adds on purpose, such as the latest revision in a 409). Unexpected errors become a 500 whose
 * body reveals nothing; the details go to the log.
 */
@Catch()
export class ApiExceptionFilter implements ExceptionFilter {
  private readonly logger = new Logger(ApiExceptionFilter.name);

  catch(exception: unknown, host: ArgumentsHost): void {
    const response = host.switchToHttp().getResponse<Response>();
    const body = toErrorBody(exception);
    if (body.statusCode >= 500) {
      this.logger.error(exception instanceof Error ? (exception.stack ?? exception.message) : String(exception));
    }
    response.status(body.statusCode).json(body);
  }
}

export function toErrorBody(exception: unknown): ErrorBody & Record<string, unknown> {
  if (exception instanceof HttpException) {
    const statusCode = exception.getStatus();
    const raw = exception.getResponse();
    const error = STATUS_CODES[statusCode] ?? 'Error';
    if (typeof raw === 'string') return { statusCode, error, message: raw };
    const { message, statusCode: _ignoredStatus, error: _ignoredError, ...extra } = raw as Record<string, unknown>;
    const text = Array.isArray(message) ? message.join('; ') : typeof message === 'string' ? message : exception.message;
    return { statusCode, error, message: text, ...extra };
  }
  // body-parser and other express-level errors carry an http status of their own
  const status = (exception as { status?: unknown } | null)?.status;
  if (typeof status === 'number' && status >= 400 && status < 500) {
    const type = (exception as { type?: unknown }).type;
    const message = type === 'entity.parse.failed' ? 'The request body is not valid JSON' : ((exception as Error).message ?? 'Bad request');
    return { statusCode: status, error: STATUS_CODES[status] ?? 'Error', message };
  }
  return { statusCode: HttpStatus.INTERNAL_SERVER_ERROR, error: 'Internal Server Error', message: 'An unexpected error occurred' };
}
