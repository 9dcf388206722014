import { describe, expect, it } from 'vitest';
import { jsonAnswer, RawJson, rawJson, rawJsonPieces, stringifyWithRawJson } from './raw-json.js';

// jsonb as PostgreSQL writes it (with its spaces), the way a pull page carries a finding's estimate.
const estimate = '{"severity": {"label": "Major", "basis": "Peak force 8.75 kN – see \\"basis\\""}, "impactEnergyJ": 9.5}';

describe('JSON text carried into an answer unparsed', () => {
  it('writes each RawJson as its own text, so the answer parses to what a full parse and stringify would give', () => {
    const page = { changes: [{ type: 'finding', record: { id: 'a', estimate: rawJson(estimate), shape: rawJson(null), notes: 'x' } }], hasMore: false };
    const json = stringifyWithRawJson(page);
    expect(json).toContain(estimate);
    expect(JSON.parse(json)).toEqual({ changes: [{ type: 'finding', record: { id: 'a', estimate: JSON.parse(estimate), shape: null, notes: 'x' } }], hasMore: false });
  });

  it('leaves alone strings that only look like its markers, and keeps the order of many texts', () => {
    const texts = Array.from({ length: 12 }, (_, i) => `{"n": ${i}}`);
    const value = { note: '\\u0000abc0', list: texts.map((t) => new RawJson(t)) };
    expect(JSON.parse(stringifyWithRawJson(value))).toEqual({ note: '\\u0000abc0', list: texts.map((t) => JSON.parse(t)) });
  });

  it('gives the parsed value to any other serialiser', () => {
    expect(JSON.parse(JSON.stringify({ estimate: new RawJson(estimate) }))).toEqual({ estimate: JSON.parse(estimate) });
    expect(stringifyWithRawJson({ plain: [1, 'two'] })).toBe(JSON.stringify({ plain: [1, 'two'] }));
  });

  it('sends the pieces of an answer as the UTF-8 bytes of the whole, characters outside ASCII included', async () => {
    const page = { changes: [{ record: rawJson(estimate) }, { record: rawJson('{"note": "Ø 48.3 mm – tube"}') }], cursor: 'ü.1' };
    const pieces = rawJsonPieces(page);
    expect(pieces.length).toBeGreaterThan(1);
    expect(pieces.join('')).toBe(stringifyWithRawJson(page));
    const chunks: Buffer[] = [];
    for await (const chunk of jsonAnswer(pieces).getStream()) chunks.push(chunk as Buffer);
    expect(Buffer.concat(chunks).equals(Buffer.from(pieces.join('')))).toBe(true);
  });
});
