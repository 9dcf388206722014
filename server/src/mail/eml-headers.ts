/**
 * Just enough of RFC 5322 / RFC 2047 to list captured messages: unfolded top-level headers and
 * decoded encoded-words. Not a MIME parser.
 */
export function parseEmlHeaders(raw: string): Map<string, string> {
  const end = raw.search(/\r?\n\r?\n/);
  const block = end === -1 ? raw : raw.slice(0, end);
  const headers = new Map<string, string>();
  const unfolded = block.replace(/\r?\n[ \t]+/g, ' ');
  for (const line of unfolded.split(/\r?\n/)) {
    const colon = line.indexOf(':');
    if (colon <= 0) continue;
    const name = line.slice(0, colon).trim().toLowerCase();
    if (!headers.has(name)) headers.set(name, decodeEncodedWords(line.slice(colon + 1).trim()));
  }
  return headers;
}

const ENCODED_WORD = /=\?([^?\s]+)\?([BbQq])\?([^?\s]*)\?=/g;

function wordBytes(encoding: string, text: string): Buffer {
  if (encoding.toUpperCase() === 'B') return Buffer.from(text, 'base64');
  const bytes: number[] = [];
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (c === '_') bytes.push(0x20);
    else if (c === '=' && /^[0-9A-Fa-f]{2}$/.test(text.slice(i + 1, i + 3))) {
      bytes.push(parseInt(text.slice(i + 1, i + 3), 16));
      i += 2;
    } else bytes.push(c.charCodeAt(0));
  }
  return Buffer.from(bytes);
}

function decodeBytes(charset: string, bytes: Buffer): string | null {
  try {
    return new TextDecoder(charset.split('*')[0].toLowerCase()).decode(bytes);
  } catch {
    return null;
  }
}

/** Decodes `=?utf-8?Q?…?=` / `=?utf-8?B?…?=` words; adjacent words of one charset are joined before decoding. */
export function decodeEncodedWords(value: string): string {
  let out = '';
  let last = 0;
  let pending: { charset: string; chunks: Buffer[]; raw: string } | null = null;
  const flush = () => {
    if (!pending) return;
    out += decodeBytes(pending.charset, Buffer.concat(pending.chunks)) ?? pending.raw;
    pending = null;
  };
  for (const match of value.matchAll(ENCODED_WORD)) {
    const [whole, charset, encoding, text] = match;
    const between = value.slice(last, match.index);
    const joinable = pending !== null && /^\s*$/.test(between) && pending.charset.toLowerCase() === charset.toLowerCase();
    if (joinable) {
      pending!.chunks.push(wordBytes(encoding, text));
      pending!.raw += whole;
    } else {
      flush();
      out += between;
      pending = { charset, chunks: [wordBytes(encoding, text)], raw: whole };
    }
    last = match.index + whole.length;
  }
  flush();
  return out + value.slice(last);
}
