import { randomUUID } from 'node:crypto';
import type { NextFunction, Request, Response } from 'express';

const REQUEST_ID = Symbol('requestId');
type WithId = Request & { [REQUEST_ID]?: string };

/** Gives every request an id, returned in `X-Request-Id` and written beside every logged 5xx. */
export function requestId(req: Request, res: Response, next: NextFunction): void {
  const id = randomUUID();
  (req as WithId)[REQUEST_ID] = id;
  res.setHeader('X-Request-Id', id);
  next();
}

export function requestIdOf(req: Request): string {
  return (req as WithId)[REQUEST_ID] ?? 'unknown';
}
