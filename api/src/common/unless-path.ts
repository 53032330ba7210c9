import type { NextFunction, Request, RequestHandler, Response } from 'express';

/** Runs `handlers` in order, except for requests to `skip` (relative to the mount point). */
export function unlessPath(skip: string, handlers: RequestHandler[]): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => {
    if (req.path === skip) return next();
    let i = 0;
    const step = (err?: unknown) => {
      if (err) return next(err);
      const handler = handlers[i++];
      if (!handler) return next();
      try {
        handler(req, res, step);
      } catch (e) {
        next(e);
      }
    };
    step();
  };
}
