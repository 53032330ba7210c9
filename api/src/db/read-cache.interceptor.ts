import { Injectable, type CallHandler, type ExecutionContext, type NestInterceptor } from '@nestjs/common';
import type { Request, Response } from 'express';
import { map, type Observable, tap } from 'rxjs';
import { AnswerReplay } from './answer-replay';
import { DataVersion } from './data-version';
import { ReadCache } from './read-cache';

const READS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * The two ends of the read cache around every route:
 * - after a request that may have written (any method but GET, HEAD,
 *   OPTIONS), and before its answer is sent, it moves this process's data
 *   version, so the writer's next read is never answered from an older
 *   entry, even before PostgreSQL's notification of the commit arrives;
 * - an answer that came from the read cache is sent as the JSON text made
 *   the first time it was sent (the same bytes), not serialised again, with
 *   the ETag made then (Express then neither hashes it again nor loses its
 *   304 for a client that already has it); once sent, AnswerReplay may keep
 *   it to answer the same request again at the door.
 */
@Injectable()
export class ReadCacheInterceptor implements NestInterceptor {
  constructor(
    private readonly version: DataVersion,
    private readonly cache: ReadCache,
    private readonly replay: AnswerReplay,
  ) {}

  intercept(context: ExecutionContext, next: CallHandler): Observable<unknown> {
    if (context.getType() !== 'http') return next.handle();
    const http = context.switchToHttp();
    if (!READS.has(http.getRequest<Request>().method)) {
      return next.handle().pipe(tap({ next: () => this.version.bump(), error: () => this.version.bump() }));
    }
    return next.handle().pipe(
      map((body: unknown) => {
        const text = this.cache.textOf(body);
        if (text === undefined) return body;
        const req = http.getRequest<Request>();
        const res = http.getResponse<Response>();
        res.type('application/json');
        res.setHeader('ETag', text.etag);
        if (req.method === 'GET') this.replay.recordWhenSent(req, res, text);
        return text.json;
      }),
    );
  }
}
