import { randomBytes } from 'node:crypto';
import { StreamableFile } from '@nestjs/common';

/** The markers of the stringify() in progress (set only while it runs; JSON.stringify is synchronous). */
let collecting: { texts: string[]; tag: string } | undefined;

/**
 * JSON text as PostgreSQL wrote it (a jsonb column read `::text`), carried in an answer as it is. A
 * pull page holds a thousand findings whose estimates are most of its bytes: parsing each one only
 * to write it out again was most of the page's time. `stringifyWithRawJson` splices the text in;
 * anything else that serialises it (`toJSON`) gets the parsed value, so it is never wrong, only slower.
 */
export class RawJson {
  constructor(readonly text: string) {}

  toJSON(): unknown {
    if (!collecting) return JSON.parse(this.text);
    collecting.texts.push(this.text);
    return `\u0000${collecting.tag}${collecting.texts.length - 1}`;
  }
}

/** A jsonb column read as text: null stays null, anything else goes into the answer unparsed. */
export function rawJson(text: unknown): RawJson | null {
  return text === null || text === undefined ? null : new RawJson(text as string);
}

/**
 * JSON.stringify, with every RawJson written as its own text. Each one is first written as a string
 * marker holding a NUL character and a tag drawn for this call; text read from PostgreSQL cannot hold
 * a NUL, so no other string of the answer can look like a marker.
 */
export function stringifyWithRawJson(value: unknown): string {
  const state = { texts: [] as string[], tag: randomBytes(6).toString('hex') };
  let json: string;
  collecting = state;
  try {
    json = JSON.stringify(value);
  } finally {
    collecting = undefined;
  }
  if (!state.texts.length) return json;
  return json.replace(new RegExp(`"\\\\u0000${state.tag}(\\d+)"`, 'g'), (_marker, index: string) => state.texts[Number(index)]!);
}

/**
 * A JSON answer already written, sent as its UTF-8 bytes: encoded once, and without the ETag Express
 * would hash over it (sync answers are megabytes, and never asked for conditionally).
 */
export function jsonAnswer(json: string): StreamableFile {
  const bytes = Buffer.from(json);
  return new StreamableFile(bytes, { type: 'application/json; charset=utf-8', length: bytes.length });
}
