import { readdirSync } from 'node:fs';
import { join, relative, sep } from 'node:path';

export type Encoding = 'br' | 'gzip';

/** URL path (e.g. `/assets/index-abc.js`) → the compressed variants the build left beside it. */
export type PrecompressedIndex = Map<string, { encodings: Encoding[] }>;

/**
 * Lists once, at start, which built files have `.br` / `.gz` siblings, so a request costs a map
 * lookup rather than two stat calls. The build is immutable while the server runs.
 */
export function findPrecompressed(dist: string): PrecompressedIndex {
  const files = new Set(
    (readdirSync(dist, { recursive: true, withFileTypes: true }) as import('node:fs').Dirent[])
      .filter((entry) => entry.isFile())
      .map((entry) => relative(dist, join(entry.parentPath, entry.name)).split(sep).join('/')),
  );
  const index: PrecompressedIndex = new Map();
  for (const file of files) {
    if (file.endsWith('.br') || file.endsWith('.gz')) continue;
    const encodings: Encoding[] = [];
    if (files.has(`${file}.br`)) encodings.push('br');
    if (files.has(`${file}.gz`)) encodings.push('gzip');
    if (encodings.length) index.set(`/${file}`, { encodings });
  }
  return index;
}
