/**
 * Keyset cursors: the sort value and id of the last row of a page, with the sort they belong to.
 * Opaque to clients (base64url JSON); decoding checks everything, so a forged cursor is a 400.
 */
export interface CursorPosition {
  sort: string;
  order: 'asc' | 'desc';
  /** The sort column's value of the last row: number, string (text or ISO instant) or null. */
  value: number | string | null;
  id: string;
}

const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_';

/** UTF-8 bytes of a string without TextEncoder (shared runs where no DOM or Node types are assumed). */
function utf8Bytes(text: string): number[] {
  const bytes: number[] = [];
  const escaped = encodeURIComponent(text);
  for (let i = 0; i < escaped.length; i++) {
    if (escaped[i] === '%') {
      bytes.push(parseInt(escaped.slice(i + 1, i + 3), 16));
      i += 2;
    } else bytes.push(escaped.charCodeAt(i));
  }
  return bytes;
}

function toBase64Url(text: string): string {
  const bytes = utf8Bytes(text);
  let out = '';
  for (let i = 0; i < bytes.length; i += 3) {
    const n = (bytes[i] << 16) | ((bytes[i + 1] ?? 0) << 8) | (bytes[i + 2] ?? 0);
    const chars = i + 2 < bytes.length ? 4 : i + 1 < bytes.length ? 3 : 2;
    for (let c = 0; c < chars; c++) out += ALPHABET[(n >> (18 - 6 * c)) & 63];
  }
  return out;
}

function fromBase64Url(encoded: string): string {
  let hex = '';
  let bits = 0;
  let buffer = 0;
  for (const ch of encoded) {
    const value = ALPHABET.indexOf(ch);
    if (value < 0) throw new Error('not base64url');
    buffer = (buffer << 6) | value;
    bits += 6;
    if (bits >= 8) {
      bits -= 8;
      hex += '%' + ((buffer >> bits) & 255).toString(16).padStart(2, '0');
    }
  }
  return decodeURIComponent(hex);
}

export function encodeCursor(position: CursorPosition): string {
  return toBase64Url(JSON.stringify([position.sort, position.order, position.value, position.id]));
}

/** The position in a cursor, or null when it is malformed or made for another sort or order. */
export function decodeCursor(cursor: string, sort: string, order: 'asc' | 'desc'): CursorPosition | null {
  try {
    const parsed: unknown = JSON.parse(fromBase64Url(cursor));
    if (!Array.isArray(parsed) || parsed.length !== 4) return null;
    const [s, o, value, id] = parsed as unknown[];
    if (s !== sort || o !== order || typeof id !== 'string') return null;
    if (value !== null && typeof value !== 'string' && !(typeof value === 'number' && Number.isFinite(value))) return null;
    return { sort, order, value, id };
  } catch {
    return null;
  }
}
