import { Inject, Injectable, type OnApplicationShutdown } from '@nestjs/common';
import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import { Pool } from 'pg';
import { APP_CONFIG } from '../config/config.tokens';
import type { AppConfig } from '../config/app-config';
import { DataVersion } from './data-version';

const PgStore = connectPgSimple(session);

/** What a request needs of the signed-in person (users.mapper toMe). */
export interface SessionUserRow {
  id: number;
  email: string;
  name: string;
  is_admin: boolean;
}

/** The session and, when it names one, its active account (users with a password), in one statement. */
const GET_WITH_USER = `
  select s.sess, (extract(epoch from s.expire) * 1000)::float8 as expire_ms, u.id as user_id, u.email as user_email, u.name as user_name, u.is_admin as user_is_admin
    from sessions s
    left join users u
      on u.id = case when s.sess->'passport'->>'user' ~ '^[0-9]{1,9}$' then (s.sess->'passport'->>'user')::int end
     and u.password_hash is not null
   where s.sid = $1 and s.expire >= to_timestamp($2)`;

/** A person read with the session is used by the request that read it, within this long. */
const USER_FRESH_MS = 1_000;
const USERS_MAX = 10_000;

/** How often one process writes a session's new expiry; sessions last 14 days, so a minute's lag is nothing. */
const TOUCH_EVERY_MS = 60_000;
const TOUCHED_MAX = 10_000;

/** Sessions (with their person) kept in memory between changes of the data version. */
const KEPT_MAX = 10_000;

interface KeptSession {
  /** DataVersion.current() read before the session was read from the database. */
  version: number;
  /** The session as stored (express-session changes the object it is given, so each request parses its own). */
  json: string;
  /** When the session ends, as stored, in ms. */
  expireMs: number;
  user: SessionUserRow | null;
}

/**
 * The rolling cookie makes express-session "touch" the session on every
 * request, and connect-pg-simple turns each touch into an UPDATE (a WAL
 * write on every GET). This store writes a session's expiry at most once a
 * minute per process; it only remembers when it last did (nothing that
 * matters: a restart or another process just touches once more).
 */
class ThrottledPgStore extends PgStore {
  private readonly touched = new Map<string, number>();
  /** The signed-in person read with each session, until passport takes it (see SessionStore.takeUser). */
  readonly users = new Map<string, { row: SessionUserRow; at: number }>();
  /**
   * Sessions read while the data version stayed put: a request answers from here without a query.
   * A change of any session's contents or of any person (by anyone: triggers notify) moves the
   * version, and this process's own writes drop the entry at once (set, destroy).
   */
  private readonly kept = new Map<string, KeptSession>();

  constructor(
    options: ConstructorParameters<typeof PgStore>[0],
    private readonly db: Pool,
    private readonly dataVersion: DataVersion,
  ) {
    super(options);
  }

  private handUser(sid: string, row: SessionUserRow | null): void {
    if (!row) return;
    if (this.users.size >= USERS_MAX) this.users.clear();
    this.users.set(sid, { row, at: Date.now() });
  }

  /**
   * connect-pg-simple's read of the session, with the person it names read in the same query
   * (a signed-in request then needs one round trip before its route, not two). Expired or
   * unknown: no session, as before. The account must still be active (a password set), as
   * UsersRepository.findActiveById requires.
   */
  override get(sid: string, fn: (err: unknown, session?: session.SessionData | null) => void): void {
    const version = this.dataVersion.current();
    const hit = this.kept.get(sid);
    if (hit && version !== null && hit.version === version && hit.expireMs >= Date.now()) {
      this.handUser(sid, hit.user);
      fn(null, JSON.parse(hit.json) as session.SessionData);
      return;
    }
    this.db.query<{ sess: unknown; expire_ms: number } & Partial<Record<'user_id' | 'user_email' | 'user_name' | 'user_is_admin', unknown>>>(GET_WITH_USER, [sid, Math.ceil(Date.now() / 1000)]).then(
      (res) => {
        const row = res.rows[0];
        if (!row) return fn(null);
        let sess: session.SessionData;
        try {
          sess = (typeof row.sess === 'string' ? JSON.parse(row.sess) : row.sess) as session.SessionData;
        } catch {
          return this.destroy(sid, (err) => fn(err));
        }
        const user =
          row.user_id !== null && row.user_id !== undefined
            ? { id: row.user_id as number, email: row.user_email as string, name: row.user_name as string, is_admin: row.user_is_admin as boolean }
            : null;
        this.handUser(sid, user);
        if (version !== null) {
          if (this.kept.size >= KEPT_MAX) this.kept.clear();
          this.kept.set(sid, { version, json: JSON.stringify(sess), expireMs: Number(row.expire_ms), user });
        }
        fn(null, sess);
      },
      (err: unknown) => fn(err),
    );
  }

  override touch(sid: string, sess: session.SessionData, fn?: (err?: unknown) => void): void {
    const now = Date.now();
    const last = this.touched.get(sid);
    if (last !== undefined && now - last < TOUCH_EVERY_MS) {
      fn?.();
      return;
    }
    if (this.touched.size >= TOUCHED_MAX) {
      for (const [key, at] of this.touched) if (now - at >= TOUCH_EVERY_MS) this.touched.delete(key);
      if (this.touched.size >= TOUCHED_MAX) this.touched.clear();
    }
    this.touched.set(sid, now);
    const hit = this.kept.get(sid);
    if (hit && sess.cookie?.expires) hit.expireMs = new Date(sess.cookie.expires).getTime();
    super.touch(sid, sess, fn);
  }

  override set(sid: string, sess: session.SessionData, fn?: (err?: unknown) => void): void {
    this.kept.delete(sid);
    super.set(sid, sess, (err?: unknown) => {
      // After the write: a read that began during it must not be kept.
      this.kept.delete(sid);
      this.dataVersion.bump();
      fn?.(err);
    });
  }

  override destroy(sid: string, fn?: (err?: unknown) => void): void {
    this.touched.delete(sid);
    this.kept.delete(sid);
    super.destroy(sid, (err?: unknown) => {
      this.kept.delete(sid);
      this.dataVersion.bump();
      fn?.(err);
    });
  }
}

/**
 * Sessions in PostgreSQL (table `sessions`, made by a migration, not by the
 * store), so a restart or a second api process keeps everyone signed in.
 * A small pool of its own: express-session talks to pg directly.
 */
@Injectable()
export class SessionStore implements OnApplicationShutdown {
  readonly store: session.Store;
  private readonly pool: Pool;

  constructor(@Inject(APP_CONFIG) config: AppConfig, dataVersion: DataVersion) {
    this.pool = new Pool({ connectionString: config.databaseUrl, max: 5 });
    this.store = new ThrottledPgStore({ pool: this.pool, tableName: 'sessions', createTableIfMissing: false, pruneSessionInterval: 15 * 60 }, this.pool, dataVersion);
  }

  /**
   * The person read with this request's session (by `get`, a moment ago), once: passport's
   * deserializer takes it instead of querying the users table again. Undefined when there is
   * none for this session and id (a concurrent request of the same session took it, or it is
   * older than a second): the caller reads the account itself.
   */
  takeUser(sid: string | undefined, id: number): SessionUserRow | undefined {
    if (!sid) return undefined;
    const users = (this.store as ThrottledPgStore).users;
    const hit = users.get(sid);
    if (!hit) return undefined;
    users.delete(sid);
    return hit.row.id === id && Date.now() - hit.at <= USER_FRESH_MS ? hit.row : undefined;
  }

  /**
   * Moves a session's expiry as express-session's rolling cookie does on each request (throttled
   * like every touch), for an answer sent without express-session (answer-replay.ts). A failed
   * write is of no consequence: the next touch writes it again.
   */
  touchExpiry(sid: string, expires: Date): void {
    this.store.touch?.(sid, { cookie: { expires, originalMaxAge: null } } as unknown as session.SessionData, () => undefined);
  }

  async onApplicationShutdown(): Promise<void> {
    await (this.store as unknown as { close(): Promise<void> }).close();
    await this.pool.end();
  }
}
