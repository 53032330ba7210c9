import { randomUUID } from 'node:crypto';
import type { IncomingMessage, OutgoingHttpHeaders, Server, ServerResponse } from 'node:http';
import { Inject, Injectable } from '@nestjs/common';
import type { Request, Response } from 'express';
import fresh from 'fresh';
import { LRUCache } from 'lru-cache';
import { CSRF_COOKIE, SESSION_COOKIE } from '@sagline/common/api-types';
import { APP_CONFIG } from '../config/config.tokens';
import type { AppConfig } from '../config/app-config';
import { DataVersion } from './data-version';
import type { SentText } from './read-cache';
import { SessionStore } from './session-store';

/**
 * Replayable answers kept per process. Sizes count each entry's body, although one body is shared by
 * every session replaying it (bytesOf): the memory really used is at most this, usually far less.
 */
const MAX_ENTRIES = 20_000;
const MAX_BODY_BYTES = 32 * 1024 * 1024;

/** Headers of the recorded answer that are made again for each replay, or by Node itself. */
const NOT_REPLAYED = new Set(['set-cookie', 'x-request-id', 'content-length', 'date', 'connection', 'keep-alive', 'transfer-encoding']);

/** What the door saw of a request it let through: the data version then, and the request's key. */
interface Seen {
  version: number;
  key: string;
}
const SEEN = Symbol('answerReplay.seen');
type SeenRequest = IncomingMessage & { [SEEN]?: Seen };

interface Recorded {
  /** The data version under which the whole request (session, person, role, answer) was decided. */
  version: number;
  /** The first moment the answer may no longer hold: the next UTC midnight (overdue flags move). */
  untilMs: number;
  headers: OutgoingHttpHeaders;
  body: Buffer;
  etag: string;
  /** The session cookie as set then; each replay sets it again with a new Expires (rolling session). */
  sessionCookie: string;
  sessionId: string;
  sessionMaxAgeMs: number;
}

/**
 * Repeated reads answered at the door, before Express, express-session,
 * passport, the guards and the route: the last step of the read cache
 * (read-cache.ts), for a manager's screens that poll and are opened again
 * and again. On a kept answer the framework's own per-request work is
 * most of the cost (about 1 ms of CPU a request, against well under 0.1 ms here).
 *
 * How it stays correct: it decides nothing itself. It replays an answer
 * that the whole pipeline gave to exactly the same request, byte for byte
 * the same session cookie, CSRF cookie and address, while nothing has
 * changed since:
 * - the data version (data-version.ts) is the same as when that request
 *   arrived and when its answer was sent. Any change to sessions, people,
 *   roles or the answer's data moves it (a sign-out, a role taken away, a
 *   new flag), as does the loss of the notification connection;
 * - it is the same UTC day (the answers count overdue flags);
 * - the answer was a 200 that set no cookie but the rolling session cookie.
 * A request with any other cookie, address or method, or with no session, goes the whole way.
 *
 * What a replay still does as the pipeline would: a new `X-Request-Id`;
 * the session cookie set again with a fresh expiry, and the session's
 * expiry moved in the store (throttled as every touch is, session-store.ts);
 * a 304 for a client that already has this ETag. READ_CACHE=pipeline (or off) turns the door off.
 */
@Injectable()
export class AnswerReplay {
  private readonly entries = new LRUCache<string, Recorded>({
    max: MAX_ENTRIES,
    maxSize: MAX_BODY_BYTES,
    sizeCalculation: (entry) => Math.max(1, entry.body.length),
  });

  /** Each kept answer's bytes, made once however many sessions replay it. */
  private readonly bodies = new WeakMap<SentText, Buffer>();

  constructor(
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly version: DataVersion,
    private readonly sessions: SessionStore,
  ) {}

  /** Puts the door in front of the server's request handler (Express's app). */
  install(server: Server): void {
    if (!this.config.answerReplay) return;
    const handlers = server.listeners('request') as ((req: IncomingMessage, res: ServerResponse) => void)[];
    server.removeAllListeners('request');
    server.on('request', (req: IncomingMessage, res: ServerResponse) => {
      if (this.replay(req, res)) return;
      for (const handle of handlers) handle.call(server, req, res);
    });
  }

  /**
   * Called by ReadCacheInterceptor for a read answered from the read cache: once the answer is
   * sent, it is kept for replay if it qualifies.
   */
  recordWhenSent(req: Request, res: Response, text: SentText): void {
    const seen = (req as SeenRequest)[SEEN];
    if (!seen) return;
    res.once('finish', () => this.record(seen, req, res, text));
  }

  /** Answers the request from a recorded answer (true), or marks what it saw and lets it through. */
  private replay(req: IncomingMessage, res: ServerResponse): boolean {
    if (req.method !== 'GET') return false;
    const version = this.version.current();
    if (version === null) return false;
    const key = keyOf(req);
    if (key === undefined) return false;
    (req as SeenRequest)[SEEN] = { version, key };
    const entry = this.entries.get(key);
    if (!entry) return false;
    const now = Date.now();
    if (entry.version !== version || now >= entry.untilMs) {
      this.entries.delete(key);
      return false;
    }
    const expires = new Date(now + entry.sessionMaxAgeMs);
    const headers: OutgoingHttpHeaders = {
      ...entry.headers,
      'x-request-id': randomUUID(),
      'set-cookie': entry.sessionCookie.replace(/Expires=[^;]*/i, `Expires=${expires.toUTCString()}`),
    };
    if (fresh(req.headers, { etag: entry.etag })) {
      // As Express answers a fresh request: no body and no content headers.
      delete headers['content-type'];
      res.writeHead(304, headers);
      res.end();
    } else {
      headers['content-length'] = entry.body.length;
      res.writeHead(200, headers);
      res.end(entry.body);
    }
    this.sessions.touchExpiry(entry.sessionId, expires);
    return true;
  }

  private record(seen: Seen, req: Request, res: Response, text: SentText): void {
    if (res.statusCode !== 200 || this.version.current() !== seen.version) return;
    const sessionId = req.sessionID;
    const sessionMaxAgeMs = req.session?.cookie.originalMaxAge;
    if (typeof sessionId !== 'string' || typeof sessionMaxAgeMs !== 'number') return;
    const setCookie = res.getHeader('set-cookie');
    const cookies = Array.isArray(setCookie) ? setCookie : typeof setCookie === 'string' ? [setCookie] : [];
    // Only the rolling session cookie: an answer that set anything else (a new CSRF cookie) is not repeated.
    if (cookies.length !== 1 || !cookies[0].startsWith(`${SESSION_COOKIE}=`)) return;
    const headers: OutgoingHttpHeaders = {};
    for (const [name, value] of Object.entries(res.getHeaders())) {
      if (!NOT_REPLAYED.has(name) && value !== undefined) headers[name] = value;
    }
    this.entries.set(seen.key, {
      version: seen.version,
      untilMs: nextUtcMidnight(Date.now()),
      headers,
      body: this.bytesOf(text),
      etag: text.etag,
      sessionCookie: cookies[0],
      sessionId,
      sessionMaxAgeMs,
    });
  }

  private bytesOf(text: SentText): Buffer {
    let bytes = this.bodies.get(text);
    if (!bytes) {
      bytes = Buffer.from(text.json);
      this.bodies.set(text, bytes);
    }
    return bytes;
  }
}

/**
 * The request's key: the session cookie, the CSRF cookie and the address, as sent (the first of
 * each cookie, as express-session and the CSRF check read them); undefined without a session cookie.
 */
function keyOf(req: IncomingMessage): string | undefined {
  const header = req.headers.cookie;
  if (!header) return undefined;
  let session: string | undefined;
  let csrf: string | undefined;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq < 0) continue;
    const name = part.slice(0, eq).trim();
    if (name === SESSION_COOKIE) session ??= part.slice(eq + 1).trim();
    else if (name === CSRF_COOKIE) csrf ??= part.slice(eq + 1).trim();
  }
  return session === undefined ? undefined : `${session}\n${csrf ?? ''}\n${req.url ?? ''}`;
}

function nextUtcMidnight(ms: number): number {
  const d = new Date(ms);
  return Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate() + 1);
}
