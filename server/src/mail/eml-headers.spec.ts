import { describe, expect, it } from 'vitest';
import { decodeEncodedWords, parseEmlHeaders } from './eml-headers.js';

describe('parseEmlHeaders', () => {
  it('reads the top-level headers, unfolds continuation lines and ignores the body', () => {
    const raw = 'From: a@x.test\r\nTo: "Long Name"\r\n <b@x.test>\r\nSubject: Hello\r\n\r\nSubject: not a header\r\n';
    const headers = parseEmlHeaders(raw);
    expect(headers.get('to')).toBe('"Long Name" <b@x.test>');
    expect(headers.get('subject')).toBe('Hello');
  });

  it('keeps the first of repeated headers and lower-cases names', () => {
    const headers = parseEmlHeaders('Received: one\nRECEIVED: two\n\nbody');
    expect(headers.get('received')).toBe('one');
  });
});

describe('decodeEncodedWords', () => {
  it('decodes Q words, where an underscore is a space', () => {
    expect(decodeEncodedWords('=?UTF-8?Q?Caf=C3=A9_au_lait?=')).toBe('Café au lait');
  });

  it('decodes B words and keeps plain text around them', () => {
    expect(decodeEncodedWords('Re: =?utf-8?B?w4lsw6l2YXRpb24=?= north')).toBe('Re: Élévation north');
  });

  it('joins adjacent words before decoding, so a character split between them survives', () => {
    // "é" is C3 A9 in UTF-8; nodemailer may split the bytes over two words.
    expect(decodeEncodedWords('=?UTF-8?Q?caf=C3?= =?UTF-8?Q?=A9?=')).toBe('café');
  });

  it('leaves words of an unknown charset as they are', () => {
    expect(decodeEncodedWords('=?x-unknown?Q?abc?=')).toBe('=?x-unknown?Q?abc?=');
  });
});
