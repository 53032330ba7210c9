/**
 * `Content-Disposition: attachment` with the file's own name: an ASCII
 * fallback in `filename` and the exact name in `filename*` (RFC 6266 §4.3,
 * RFC 8187 UTF-8 encoding), so names with accents or quotes survive.
 */
export function attachment(fileName: string): string {
  const fallback = fileName.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
  const encoded = encodeURIComponent(fileName).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `attachment; filename="${fallback}"; filename*=UTF-8''${encoded}`;
}
