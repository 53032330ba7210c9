import { inflateRawSync } from 'node:zlib';

/**
 * Reads a zip archive's central directory (PKWARE APPNOTE 6.3.x, §4.3: end of
 * central directory record, central directory headers, ZIP64 records) and
 * checks, before any spreadsheet library opens it, that it is whole and will
 * not expand without bound (a "zip bomb"). Each entry is inflated once with
 * an output cap equal to its declared size, so an entry that lies about its
 * size is caught too; nothing inflated is kept.
 */

export interface ZipEntry {
  name: string;
  method: number;
  flags: number;
  compressedSize: number;
  uncompressedSize: number;
  localHeaderOffset: number;
}

export interface ZipLimits {
  /** Total bytes all entries may expand to. */
  maxUnzippedBytes: number;
  /** Largest expansion ratio (unzipped / file size), applied when the total is above `ratioFloorBytes`. */
  maxRatio: number;
  ratioFloorBytes?: number;
  /** At most this many entries. */
  maxEntries?: number;
}

/** Why an archive was refused, in words for the person who uploaded it. */
export class ZipRejected extends Error {
  constructor(
    readonly reason: 'damaged' | 'too-large' | 'encrypted' | 'unsupported',
    message: string,
  ) {
    super(message);
    this.name = 'ZipRejected';
  }
}

const SIG_EOCD = 0x06054b50;
const SIG_ZIP64_LOCATOR = 0x07064b50;
const SIG_ZIP64_EOCD = 0x06064b50;
const SIG_CENTRAL = 0x02014b50;
const SIG_LOCAL = 0x04034b50;
const MAX_COMMENT = 0xffff;

const damaged = (what: string) =>
  new ZipRejected('damaged', `The file is damaged or incomplete (${what}). Save the workbook again from your spreadsheet program and upload the new file.`);

function u64(buf: Buffer, at: number): number {
  const v = buf.readBigUInt64LE(at);
  if (v > BigInt(Number.MAX_SAFE_INTEGER)) throw damaged('a size field is out of range');
  return Number(v);
}

/** Starts with the local file header signature "PK\x03\x04" (or is an empty archive). */
export function looksLikeZip(buf: Buffer): boolean {
  return buf.length >= 4 && (buf.readUInt32LE(0) === SIG_LOCAL || buf.readUInt32LE(0) === SIG_EOCD);
}

/** The entries of the central directory, without inflating anything. */
export function readCentralDirectory(buf: Buffer, maxEntries = 10_000): ZipEntry[] {
  if (buf.length < 22) throw damaged('too short to be a zip archive');
  let eocd = -1;
  const stop = Math.max(0, buf.length - 22 - MAX_COMMENT);
  for (let i = buf.length - 22; i >= stop; i--) {
    if (buf.readUInt32LE(i) === SIG_EOCD) {
      eocd = i;
      break;
    }
  }
  if (eocd < 0) throw damaged('its table of contents at the end is missing; the upload may have been cut short');
  let count = buf.readUInt16LE(eocd + 10);
  let cdSize = buf.readUInt32LE(eocd + 12);
  let cdOffset = buf.readUInt32LE(eocd + 16);
  if (count === 0xffff || cdSize === 0xffffffff || cdOffset === 0xffffffff) {
    const loc = eocd - 20;
    if (loc < 0 || buf.readUInt32LE(loc) !== SIG_ZIP64_LOCATOR) throw damaged('a ZIP64 record is missing');
    const z = u64(buf, loc + 8);
    if (z + 56 > buf.length || buf.readUInt32LE(z) !== SIG_ZIP64_EOCD) throw damaged('the ZIP64 record is misplaced');
    count = u64(buf, z + 32);
    cdSize = u64(buf, z + 40);
    cdOffset = u64(buf, z + 48);
  }
  if (count > maxEntries) throw new ZipRejected('too-large', `The file holds ${count} parts; a workbook has a few dozen. It is not a member schedule workbook.`);
  if (cdOffset + cdSize > buf.length) throw damaged('its table of contents points past the end of the file');

  const entries: ZipEntry[] = [];
  let p = cdOffset;
  for (let n = 0; n < count; n++) {
    if (p + 46 > buf.length || buf.readUInt32LE(p) !== SIG_CENTRAL) throw damaged(`entry ${n + 1} of its table of contents is unreadable`);
    const flags = buf.readUInt16LE(p + 8);
    const method = buf.readUInt16LE(p + 10);
    let compressedSize = buf.readUInt32LE(p + 20);
    let uncompressedSize = buf.readUInt32LE(p + 24);
    const nameLen = buf.readUInt16LE(p + 28);
    const extraLen = buf.readUInt16LE(p + 30);
    const commentLen = buf.readUInt16LE(p + 32);
    let localHeaderOffset = buf.readUInt32LE(p + 42);
    const nameStart = p + 46;
    if (nameStart + nameLen + extraLen + commentLen > buf.length) throw damaged(`entry ${n + 1} runs past the end of the file`);
    const name = buf.toString('utf8', nameStart, nameStart + nameLen);
    // ZIP64 extended information (header id 0x0001): the 64-bit values, in this order, of the fields set to 0xFFFFFFFF.
    let e = nameStart + nameLen;
    const extraEnd = e + extraLen;
    while (e + 4 <= extraEnd) {
      const id = buf.readUInt16LE(e);
      const size = buf.readUInt16LE(e + 2);
      if (id === 0x0001) {
        let q = e + 4;
        if (uncompressedSize === 0xffffffff && q + 8 <= e + 4 + size) (uncompressedSize = u64(buf, q)), (q += 8);
        if (compressedSize === 0xffffffff && q + 8 <= e + 4 + size) (compressedSize = u64(buf, q)), (q += 8);
        if (localHeaderOffset === 0xffffffff && q + 8 <= e + 4 + size) localHeaderOffset = u64(buf, q);
      }
      e += 4 + size;
    }
    entries.push({ name, method, flags, compressedSize, uncompressedSize, localHeaderOffset });
    p = extraEnd + commentLen;
  }
  return entries;
}

/**
 * Checks the whole archive: declared sizes within the caps, every entry
 * stored or deflated, not encrypted, and inflating to no more than it
 * declares. Throws ZipRejected; returns the entries when all is well.
 */
export function checkZip(buf: Buffer, limits: ZipLimits): ZipEntry[] {
  const entries = readCentralDirectory(buf, limits.maxEntries);
  const size = (n: number) => (n >= 1024 * 1024 ? `${Math.round(n / 1024 / 1024)} MB` : `${Math.max(1, Math.round(n / 1024))} KB`);
  const tooLarge = (total: number) =>
    new ZipRejected(
      'too-large',
      `The workbook would expand to ${total > limits.maxUnzippedBytes ? `more than ${size(limits.maxUnzippedBytes)}` : size(total)} when opened (from a ${size(buf.length)} file), far more than any member schedule; it is refused as a possible zip bomb. Upload the schedule saved normally from a spreadsheet program, or split it.`,
    );
  const lying = (name: string) =>
    new ZipRejected(
      'too-large',
      `Part "${name}" of the workbook expands to more than its table of contents says; the file is malformed or a zip bomb, and it is refused. Upload the schedule saved normally from a spreadsheet program.`,
    );
  let declared = 0;
  for (const entry of entries) {
    if (entry.flags & 0x1) throw new ZipRejected('encrypted', 'The workbook is password-protected (encrypted). Remove the password in your spreadsheet program, save, and upload again.');
    if (entry.method !== 0 && entry.method !== 8) {
      throw new ZipRejected('unsupported', `Part "${entry.name}" of the workbook is compressed with method ${entry.method}, which only some programs read. Save the workbook again as an ordinary .xlsx and upload it.`);
    }
    declared += entry.uncompressedSize;
  }
  const floor = limits.ratioFloorBytes ?? 10 * 1024 * 1024;
  if (declared > limits.maxUnzippedBytes || (declared > floor && declared / Math.max(buf.length, 1) > limits.maxRatio)) throw tooLarge(declared);

  let actual = 0;
  for (const entry of entries) {
    const { start, end } = entryData(buf, entry);
    if (entry.method === 0) {
      if (entry.compressedSize !== entry.uncompressedSize) throw damaged(`part "${entry.name}" has inconsistent sizes`);
      actual += entry.uncompressedSize;
      continue;
    }
    let out: Buffer;
    try {
      // One byte over the declared size proves the declaration false without inflating the rest.
      out = inflateRawSync(buf.subarray(start, end), { maxOutputLength: Math.max(1, entry.uncompressedSize + 1) });
    } catch (e) {
      if ((e as { code?: string }).code === 'ERR_BUFFER_TOO_LARGE') throw lying(entry.name);
      throw damaged(`part "${entry.name}" cannot be decompressed`);
    }
    if (out.length !== entry.uncompressedSize) throw damaged(`part "${entry.name}" is shorter than its table of contents says`);
    actual += out.length;
    if (actual > limits.maxUnzippedBytes) throw tooLarge(actual);
  }
  return entries;
}

/** Where an entry's (compressed) bytes lie in the archive, after its local file header. */
function entryData(buf: Buffer, entry: ZipEntry): { start: number; end: number } {
  const p = entry.localHeaderOffset;
  if (p + 30 > buf.length || buf.readUInt32LE(p) !== SIG_LOCAL) throw damaged(`part "${entry.name}" is missing`);
  const start = p + 30 + buf.readUInt16LE(p + 26) + buf.readUInt16LE(p + 28);
  const end = start + entry.compressedSize;
  if (end > buf.length) throw damaged(`part "${entry.name}" is cut short`);
  return { start, end };
}

/**
 * One entry's content, for an archive checkZip has already accepted (the
 * output is capped at the declared size all the same).
 */
export function inflateEntry(buf: Buffer, entry: ZipEntry): Buffer {
  const { start, end } = entryData(buf, entry);
  if (entry.method === 0) return buf.subarray(start, end);
  return inflateRawSync(buf.subarray(start, end), { maxOutputLength: Math.max(1, entry.uncompressedSize) });
}
