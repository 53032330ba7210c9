import type { ImportFileType } from '@sagline/common/api-types';
import { ApiError } from '../common/api-error';
import { checkZip, looksLikeZip, ZipRejected, type ZipLimits } from './zip-guard';

/** An upload whose type was decided from its content, with CSV text already decoded. */
export type SniffedFile = { type: 'xlsx' } | { type: 'csv'; text: string };

const HOW = 'Upload the member schedule as an Excel workbook (.xlsx) or as comma-separated text (.csv); the template download shows the columns.';

function invalid(what: string): ApiError {
  return new ApiError('IMPORT_FILE_INVALID', `${what} ${HOW}`);
}

// OLE2 compound document: .xls, .doc and other Office 97–2003 files.
const OLE2 = Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]);

/**
 * Decides what an upload is from its bytes, never from its name: an xlsx is a
 * zip archive (checked whole and for zip bombs first) holding
 * xl/workbook.xml; a CSV is text (UTF-8, or UTF-16 with a byte-order mark,
 * as "Unicode text" exports are). Anything else: 400 IMPORT_FILE_INVALID
 * saying what the file seems to be.
 */
export function sniffUpload(buf: Buffer, fileName: string, zipLimits: ZipLimits): SniffedFile {
  if (buf.length === 0) throw invalid(`"${fileName}" is empty (0 bytes).`);
  if (looksLikeZip(buf)) {
    let names: string[];
    try {
      names = checkZip(buf, zipLimits).map((e) => e.name);
    } catch (e) {
      if (e instanceof ZipRejected) throw new ApiError('IMPORT_FILE_INVALID', `"${fileName}": ${e.message}`);
      throw e;
    }
    if (names.includes('xl/workbook.xml')) return { type: 'xlsx' };
    if (names.includes('xl/workbook.bin')) throw invalid(`"${fileName}" is a binary Excel workbook (.xlsb), which Sagline does not read. Save it as .xlsx.`);
    if (names.includes('mimetype') && names.some((n) => n === 'content.xml')) {
      throw invalid(`"${fileName}" is an OpenDocument file (.ods). Save it as .xlsx ("Excel 2007-365") or .csv.`);
    }
    if (names.includes('word/document.xml')) throw invalid(`"${fileName}" is a Word document, not a spreadsheet.`);
    throw invalid(`"${fileName}" is a zip archive but not an Excel workbook (it has no xl/workbook.xml).`);
  }
  if (buf.length >= 8 && buf.subarray(0, 8).equals(OLE2)) {
    throw invalid(`"${fileName}" is an Excel 97-2003 workbook (.xls) or another old Office file, which Sagline does not read. Save it as .xlsx.`);
  }
  const text = decodeText(buf);
  if (text === null) throw invalid(`"${fileName}" is not a spreadsheet: it is neither an .xlsx workbook nor text.`);
  return { type: 'csv', text };
}

/** The text of a file, or null when it is binary (not valid UTF-8/UTF-16, or holding control characters). */
function decodeText(buf: Buffer): string | null {
  let text: string;
  try {
    if (buf.length >= 2 && buf[0] === 0xff && buf[1] === 0xfe) text = new TextDecoder('utf-16le', { fatal: true }).decode(buf.subarray(2));
    else if (buf.length >= 2 && buf[0] === 0xfe && buf[1] === 0xff) text = new TextDecoder('utf-16be', { fatal: true }).decode(buf.subarray(2));
    else text = new TextDecoder('utf-8', { fatal: true }).decode(buf);
  } catch {
    return null;
  }
  // Tab, line feed, carriage return and form feed are text; other C0 controls (and NUL) mean binary.
  if (/[\u0000-\u0008\u000b\u000e-\u001f\u007f]/.test(text)) return null;
  return text;
}

/** The type as stored with the revision. */
export function fileTypeOf(file: SniffedFile): ImportFileType {
  return file.type;
}
