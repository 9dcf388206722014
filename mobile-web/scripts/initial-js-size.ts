import { gzipSync } from 'node:zlib';
import type { Plugin } from 'vite';

/** Kibibytes: 1 KiB = 1024 bytes. */
const KIB = 1024;

interface ChunkLike {
  type: 'chunk';
  isEntry: boolean;
  fileName: string;
  code: string;
  imports: string[];
}

interface InitialJsReport {
  /** Files the phone downloads before its first screen can run, on the heaviest way in. */
  files: string[];
  /** Sum of each file gzipped on its own (zlib default level, as a typical server sends it), in bytes. */
  gzipBytes: number;
  /** The entry of that way in (one per page: index.html for the app, sign-in.html). */
  start: string;
  /** Every page's entry and its initial JS in bytes (gzip), the heaviest included. */
  pages: { start: string; gzipBytes: number }[];
}

/**
 * Each page (index.html, sign-in.html) has one entry chunk; what a phone downloads before that
 * page's first screen can run is the entry and everything it imports statically (the HTML asks
 * for all of it up front). What the entry imports on demand (the pages of the app, the sign-in's
 * local database, the app after sign-in) loads later and does not count. The report is for the
 * heaviest page.
 */
export function measureInitialJs(bundle: Record<string, ChunkLike | { type: 'asset' }>): InitialJsReport {
  const chunks = Object.values(bundle).filter((item): item is ChunkLike => item.type === 'chunk');
  const byName = new Map(chunks.map((chunk) => [chunk.fileName, chunk]));
  const closure = (root: string) => {
    const seen = new Set<string>();
    const pending = [root];
    while (pending.length > 0) {
      const fileName = pending.pop()!;
      if (seen.has(fileName)) continue;
      seen.add(fileName);
      pending.push(...(byName.get(fileName)?.imports ?? []));
    }
    return seen;
  };
  const gzipOf = (files: Iterable<string>) => [...files].reduce((sum, file) => sum + gzipSync(byName.get(file)?.code ?? '').length, 0);
  const ways = chunks
    .filter((chunk) => chunk.isEntry)
    .map((entry) => {
      const files = [...closure(entry.fileName)].sort();
      return { files, gzipBytes: gzipOf(files), start: entry.fileName };
    });
  const pages = ways.map(({ start, gzipBytes }) => ({ start, gzipBytes }));
  if (ways.length === 0) return { files: [], gzipBytes: 0, start: '', pages };
  return { ...ways.reduce((heaviest, way) => (way.gzipBytes > heaviest.gzipBytes ? way : heaviest)), pages };
}

/**
 * Prints "initial JS: N KiB gzip" after a client build, and warns past the budget
 * (the initial JavaScript stays at or under 200 KiB gzip).
 */
export function initialJsSize(options: { budgetKiB: number }): Plugin {
  return {
    name: 'plummet:initial-js-size',
    apply: 'build',
    generateBundle(_outputOptions, bundle) {
      const { files, gzipBytes, start, pages } = measureInitialJs(bundle as Parameters<typeof measureInitialJs>[0]);
      const kib = gzipBytes / KIB;
      const verdict = kib <= options.budgetKiB ? 'within' : 'OVER';
      this.info(`${files.length} file(s): ${files.join(', ')}`);
      // Printed with console.log so that it shows even with --logLevel warn and is easy to grep.
      console.log(`initial JS: ${kib.toFixed(1)} KiB gzip by way of ${start} (${verdict} the ${options.budgetKiB} KiB budget)`);
      if (pages.length > 1) console.log(`  per page: ${pages.map((p) => `${p.start} ${(p.gzipBytes / KIB).toFixed(1)} KiB`).join(', ')}`);
      if (verdict === 'OVER') this.warn(`initial JS is over the ${options.budgetKiB} KiB gzip budget`);
    },
  };
}
