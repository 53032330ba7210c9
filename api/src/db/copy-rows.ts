import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { from as copyFrom } from 'pg-copy-streams';
import type { Trx } from './transaction';

/** A value of one COPY field: numbers, text, booleans, or null. */
export type CopyValue = string | number | boolean | null | undefined;

const ESCAPES: Record<string, string> = { '\\': '\\\\', '\t': '\\t', '\n': '\\n', '\r': '\\r' };
const NEEDS_ESCAPE = /[\\\t\n\r]/;

/**
 * One field in COPY's text format: `\N` for null, backslash escapes for
 * backslash, tab, newline and carriage return. Numbers go as JavaScript's
 * shortest round-trip text (PostgreSQL reads that back to the same double),
 * booleans as t/f.
 */
export function copyField(v: CopyValue): string {
  if (v === null || v === undefined) return '\\N';
  if (typeof v === 'number') return String(v);
  if (typeof v === 'boolean') return v ? 't' : 'f';
  return NEEDS_ESCAPE.test(v) ? v.replace(/[\\\t\n\r]/g, (c) => ESCAPES[c]) : v;
}

/** Rows per chunk handed to the connection (about 100–300 kB of text). */
const ROWS_PER_CHUNK = 2000;

/**
 * Writes rows into `table` with `COPY … FROM STDIN` on the transaction's own
 * connection, so they are part of it (a rollback removes them; a failure
 * mid-way sends CopyFail and the transaction fails as a whole). Rows are
 * turned into text chunk by chunk while PostgreSQL takes the previous chunk,
 * and `onChunk(rows)` follows each chunk. Knex has no COPY; this is the one
 * place that reaches under it, for bulk writes of tens of thousands of rows.
 */
export async function copyRows(
  trx: Trx,
  table: string,
  columns: readonly string[],
  count: number,
  row: (index: number) => readonly CopyValue[],
  onChunk?: (rows: number) => void,
): Promise<void> {
  if (count === 0) return;
  const connection = (await (trx.client as { acquireConnection(): Promise<unknown> }).acquireConnection()) as {
    query<T>(stream: T): T;
  };
  const sql = `copy ${table} (${columns.map((c) => `"${c}"`).join(', ')}) from stdin`;
  function* chunks(): Generator<string> {
    for (let start = 0; start < count; start += ROWS_PER_CHUNK) {
      const end = Math.min(count, start + ROWS_PER_CHUNK);
      let text = '';
      for (let i = start; i < end; i++) {
        const values = row(i);
        let line = copyField(values[0]);
        for (let j = 1; j < values.length; j++) line += `\t${copyField(values[j])}`;
        text += `${line}\n`;
      }
      yield text;
      onChunk?.(end - start);
    }
  }
  await pipeline(Readable.from(chunks(), { objectMode: false }), connection.query(copyFrom(sql)));
}
