import { STATUS_CODES } from 'node:http';
import { HttpException } from '@nestjs/common';
import type { ApiErrorBody, ErrorCode } from '@sagline/common/api-types';
import { ApiError } from './api-error';

export interface MappedError {
  status: number;
  body: ApiErrorBody;
  /** True for our own failures (5xx): logged with the request id and the stack. */
  unexpected: boolean;
}

/** Maps anything thrown anywhere to the one error shape. Never exposes a stack or internals. */
export function toErrorBody(exception: unknown, requestId: string): MappedError {
  if (exception instanceof ApiError) {
    return make(exception.status, exception.code, exception.message, exception.details);
  }
  const bodyParser = bodyParserError(exception);
  if (bodyParser) return bodyParser;
  if (exception instanceof HttpException) return fromHttpException(exception, requestId);
  const pg = postgresError(exception);
  if (pg) return pg;
  return {
    ...make(500, 'INTERNAL', `Something went wrong on our side. It was logged with request id ${requestId}; please try again.`),
    unexpected: true,
  };
}

function make(status: number, code: ErrorCode, message: string, details?: ApiErrorBody['details']): MappedError {
  const body: ApiErrorBody = { statusCode: status, error: STATUS_CODES[status] ?? 'Error', code, message };
  if (details?.length) body.details = details;
  return { status, body, unexpected: status >= 500 };
}

/** Errors of the JSON body parser (body-parser inside Express), recognised by their `type`. */
function bodyParserError(e: unknown): MappedError | null {
  const type = (e as { type?: unknown } | null)?.type;
  if (typeof type !== 'string') return null;
  if (type === 'entity.parse.failed') {
    return make(400, 'MALFORMED_JSON', 'The request body is not valid JSON: check quotes, commas and brackets.');
  }
  if (type === 'entity.too.large') {
    const limit = (e as { limit?: number }).limit;
    return make(413, 'PAYLOAD_TOO_LARGE', `The request body is larger than the ${limit ? `${Math.round(limit / 1024)} KiB` : ''} limit; send less data.`.replace('  ', ' '));
  }
  if (type === 'encoding.unsupported' || type === 'charset.unsupported') {
    return make(415, 'VALIDATION_FAILED', 'The request body must be JSON encoded as UTF-8.');
  }
  if (type === 'request.aborted') return make(400, 'VALIDATION_FAILED', 'The request was aborted before its body arrived.');
  return null;
}

/** Nest's own exceptions (unknown route, bad parameter pipes...) in our shape. */
function fromHttpException(e: HttpException, requestId: string): MappedError {
  const status = e.getStatus();
  const response = e.getResponse();
  const raw = typeof response === 'string' ? response : (response as { message?: unknown }).message;
  const message = Array.isArray(raw) ? raw.join('; ') : typeof raw === 'string' ? raw : e.message;
  const code: ErrorCode =
    status === 401 ? 'UNAUTHENTICATED'
    : status === 403 ? 'FORBIDDEN'
    : status === 404 ? 'NOT_FOUND'
    : status === 409 ? 'CONFLICT'
    : status === 413 ? 'PAYLOAD_TOO_LARGE'
    : status === 429 ? 'RATE_LIMITED'
    : status >= 500 ? 'INTERNAL'
    : 'VALIDATION_FAILED';
  if (status >= 500) {
    return { ...make(status, code, `Something went wrong on our side. It was logged with request id ${requestId}; please try again.`), unexpected: true };
  }
  const text = status === 404 && /^Cannot (GET|POST|PUT|PATCH|DELETE|HEAD|OPTIONS) /.test(message)
    ? `There is no API route ${message.replace(/^Cannot /, '')}; check the address.`
    : message;
  return make(status, code, text);
}

/**
 * A unique-key violation that slipped past the service's own check (two
 * requests at once) is the caller's conflict, not our failure.
 */
function postgresError(e: unknown): MappedError | null {
  const code = (e as { code?: unknown } | null)?.code;
  if (code === '23505') return make(409, 'CONFLICT', 'This would duplicate something that already exists; reload and try again.');
  return null;
}
