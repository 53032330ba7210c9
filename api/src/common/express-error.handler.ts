import { Logger } from '@nestjs/common';
import type { NextFunction, Request, Response } from 'express';
import { sendError } from './all-exceptions.filter';

const logger = new Logger('http');

/**
 * Express error middleware for failures before a route runs (body parser,
 * session store): Nest's filter never sees those, so they get the same shape here.
 */
export function expressErrorHandler(err: unknown, req: Request, res: Response, _next: NextFunction): void {
  sendError(err, req, res, logger);
}
