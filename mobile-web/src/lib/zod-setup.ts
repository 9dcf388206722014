import { config } from 'zod/v4/core';

/*
 * The server's Content-Security-Policy forbids eval. When zod builds its first object schema it
 * tries `new Function` to see whether it may compile faster parsers; the browser blocks the try
 * and reports it as a security issue of the page. Told to go without, zod skips the try and
 * parses as it does under that policy anyway. Imported by each page's entry, before any schema.
 */
config({ jitless: true });
