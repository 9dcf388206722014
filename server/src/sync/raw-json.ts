import { randomBytes } from 'node:crypto';
import { StreamableFile } from '@nestjs/common';

/** The markers of the stringify() in progress (set only while it runs; JSON.stringify is synchronous). */
let collecting: { texts: string[]; tag: string } | undefined;

/**
 * JSON text as PostgreSQL wrote it (a json or jsonb column read `::text`), carried in an answer as it is. A
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

/** A json or jsonb column read as text: null stays null, anything else goes into the answer unparsed. */
export function rawJson(text: unknown): RawJson | null {
  return text === null || text === undefined ? null : new RawJson(text as string);
}

/**
 * JSON.stringify, with every RawJson written as its own text. Each one is first written as a string
 * marker holding a NUL character and a tag drawn for this call; text read from PostgreSQL cannot hold
 * a NUL, so no other string of the answer can look like a marker.
 */
export function stringifyWithRawJson(value: unknown): string {
  return rawJsonPieces(value).join('');
}

/**
 * The same JSON as stringifyWithRawJson, as the pieces it is made of, in order (to be written out
 * one after another: a page is megabytes, and one string of it would be copied whole once more).
 */
export function rawJsonPieces(value: unknown): string[] {
  const state = { texts: [] as string[], tag: randomBytes(6).toString('hex') };
  let json: string;
  collecting = state;
  try {
    json = JSON.stringify(value);
  } finally {
    collecting = undefined;
  }
  if (!state.texts.length) return [json];
  // Split around the markers; with the index captured, every odd piece is the index of a text.
  const pieces = json.split(new RegExp(`"\\\\u0000${state.tag}(\\d+)"`));
  for (let i = 1; i < pieces.length; i += 2) pieces[i] = state.texts[Number(pieces[i])]!;
  return pieces;
}

/**
 * A JSON answer already written (whole, or in pieces to be joined), sent as its UTF-8 bytes: each
 * piece encoded once into one buffer, and without the ETag Express would hash over it (sync
 * answers are megabytes, and never asked for conditionally).
 */
export function jsonAnswer(json: string | string[]): StreamableFile {
  const pieces = typeof json === 'string' ? [json] : json;
  let length = 0;
  for (const piece of pieces) length += Buffer.byteLength(piece);
  const bytes = Buffer.allocUnsafe(length);
  let at = 0;
  for (const piece of pieces) at += bytes.write(piece, at);
  return new StreamableFile(bytes, { type: 'application/json; charset=utf-8', length: bytes.length });
}
