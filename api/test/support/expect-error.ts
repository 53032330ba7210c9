import { STATUS_CODES } from 'node:http';
import type { Response } from 'supertest';
import type { ApiErrorBody, ErrorCode } from '@sagline/common/api-types';

/**
 * The one error shape, checked the same way everywhere: status, reason
 * phrase, code, a message for a person, no other fields (never a stack).
 * `message` may be an exact text or a pattern. Returns the body.
 */
export function expectError(res: Response, status: number, code: ErrorCode, message?: string | RegExp): ApiErrorBody {
  const body = res.body as ApiErrorBody;
  const req = (res as unknown as { req?: { method?: string; path?: string } }).req;
  const context = `${req?.method} ${req?.path} → ${res.status} ${JSON.stringify(body)}`;
  expect({ status: res.status, code: body?.code, context }).toEqual({ status, code, context });
  expect(res.headers['content-type']).toMatch(/^application\/json/);
  const keys = Object.keys(body).sort();
  expect(keys).toEqual(body.details ? ['code', 'details', 'error', 'message', 'statusCode'] : ['code', 'error', 'message', 'statusCode']);
  expect(body.statusCode).toBe(status);
  expect(body.error).toBe(STATUS_CODES[status]);
  expect(typeof body.message).toBe('string');
  expect(body.message.length).toBeGreaterThan(10);
  expect(JSON.stringify(body)).not.toMatch(/\bat .+\.(ts|js):\d+/);
  if (message instanceof RegExp) expect(body.message).toMatch(message);
  else if (message !== undefined) expect(body.message).toBe(message);
  return body;
}
