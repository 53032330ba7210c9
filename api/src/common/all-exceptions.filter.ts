import { Catch, Logger, type ArgumentsHost, type ExceptionFilter } from '@nestjs/common';
import type { Request, Response } from 'express';
import { ApiError } from './api-error';
import { toErrorBody } from './error-body';
import { requestIdOf } from './request-id.middleware';

/** The one filter: every failure of every route leaves in the one error shape. */
@Catch()
export class AllExceptionsFilter implements ExceptionFilter {
  private readonly logger = new Logger('http');

  catch(exception: unknown, host: ArgumentsHost): void {
    const http = host.switchToHttp();
    const req = http.getRequest<Request>();
    const res = http.getResponse<Response>();
    sendError(exception, req, res, this.logger);
  }
}

/** Shared by the filter and the Express error handler (errors raised before Nest's router). */
export function sendError(exception: unknown, req: Request, res: Response, logger: Logger): void {
  const requestId = requestIdOf(req);
  const { status, body, unexpected } = toErrorBody(exception, requestId);
  if (unexpected) {
    // Our own 5xx answers (database down, mailbox not running) carry their reason; anything else its stack.
    const stack = exception instanceof ApiError ? exception.message : exception instanceof Error ? exception.stack : String(exception);
    logger.error(`${req.method} ${req.originalUrl} failed (request id ${requestId}): ${stack}`);
  }
  if (res.headersSent) {
    res.end();
    return;
  }
  res.status(status).json(body);
}
