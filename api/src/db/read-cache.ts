import { Injectable } from '@nestjs/common';
import etag from 'etag';
import { LRUCache } from 'lru-cache';
import { DataVersion } from './data-version';

/** Answers kept per process; old versions' entries are simply never asked for again and age out. */
const MAX_ENTRIES = 2_000;

type Loader = () => Promise<unknown>;

/** A kept answer as sent: its JSON text and the weak ETag Express would compute for it. */
export interface SentText {
  json: string;
  etag: string;
}

/**
 * Answers of read routes kept in memory while the data they came from is
 * unchanged (DataVersion): the Members page, the flags summary, the
 * Overview. The key names the route and everything the answer depends on
 * (project, query); the data version and today's UTC date (overdue flags
 * move at midnight) are added here. Concurrent requests for the same key
 * share one load. What is returned is shared: callers must not change it.
 */
@Injectable()
export class ReadCache {
  private readonly entries = new LRUCache<string, object, Loader>({
    max: MAX_ENTRIES,
    fetchMethod: (_key, _stale, { context }) => context() as Promise<object>,
  });

  /** The JSON text (and ETag) of each kept answer, made when it is first sent (ReadCacheInterceptor). */
  private readonly texts = new WeakMap<object, SentText | null>();

  constructor(private readonly version: DataVersion) {}

  async get<T extends object>(key: string, load: () => Promise<T>): Promise<T> {
    const v = this.version.current();
    if (v === null) return load();
    const full = `${v}|${new Date().toISOString().slice(0, 10)}|${key}`;
    const value = (await this.entries.fetch(full, { context: load })) as T;
    if (value && !this.texts.has(value)) this.texts.set(value, null);
    return value;
  }

  /** The JSON text and ETag of an answer this cache gave out (made once), or undefined for any other value. */
  textOf(value: unknown): SentText | undefined {
    if (value === null || typeof value !== 'object') return undefined;
    const text = this.texts.get(value);
    if (text === undefined) return undefined;
    if (text !== null) return text;
    const json = JSON.stringify(value);
    const made = { json, etag: etag(json, { weak: true }) };
    this.texts.set(value, made);
    return made;
  }

  /** Forgets everything (tests; a limit-set change also moves the version). */
  clear(): void {
    this.entries.clear();
  }
}
