import { Injectable } from '@nestjs/common';
import etag from 'etag';
import { LRUCache } from 'lru-cache';
import { DataVersion } from './data-version';

/**
 * Answers kept per process, at most this many and this much JSON text (a Members page of 200 rows
 * is about 80 kB); old versions' entries are simply never asked for again and age out first.
 */
const MAX_ENTRIES = 2_000;
const MAX_TEXT_BYTES = 32 * 1024 * 1024;

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
    maxSize: MAX_TEXT_BYTES,
    // Measured by the JSON text the answer is sent as, made here once (ReadCacheInterceptor sends it).
    sizeCalculation: (value) => Math.max(1, this.made(value).json.length),
    fetchMethod: (_key, _stale, { context }) => context() as Promise<object>,
  });

  /** The JSON text (and ETag) of each kept answer, made once. */
  private readonly texts = new WeakMap<object, SentText>();

  constructor(private readonly version: DataVersion) {}

  async get<T extends object>(key: string, load: () => Promise<T>): Promise<T> {
    const v = this.version.current();
    if (v === null) return load();
    const full = `${v}|${new Date().toISOString().slice(0, 10)}|${key}`;
    return (await this.entries.fetch(full, { context: load })) as T;
  }

  /** The JSON text and ETag of an answer this cache gave out, or undefined for any other value. */
  textOf(value: unknown): SentText | undefined {
    return value !== null && typeof value === 'object' ? this.texts.get(value) : undefined;
  }

  private made(value: object): SentText {
    let text = this.texts.get(value);
    if (!text) {
      const json = JSON.stringify(value);
      text = { json, etag: etag(json, { weak: true }) };
      this.texts.set(value, text);
    }
    return text;
  }
}
