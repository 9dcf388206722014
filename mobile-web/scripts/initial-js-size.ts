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
  dynamicImports: string[];
}

interface InitialJsReport {
  /** Files the phone downloads before its first screen can run, on the heaviest way in. */
  files: string[];
  /** Sum of each file gzipped on its own (zlib default level, as a typical server sends it), in bytes. */
  gzipBytes: number;
  /** The start chunk of that way in (the entry itself when it starts nothing on demand). */
  start: string;
}

/**
 * The entry (src/main.tsx) only decides which start to load: the standalone sign-in or the full
 * app. What a phone downloads first is therefore the entry, one of the chunks it imports on demand
 * and their static imports; deeper dynamic imports (the pages) load later and do not count. The
 * report is for the heaviest of those starts.
 */
export function measureInitialJs(bundle: Record<string, ChunkLike | { type: 'asset' }>): InitialJsReport {
  const chunks = Object.values(bundle).filter((item): item is ChunkLike => item.type === 'chunk');
  const byName = new Map(chunks.map((chunk) => [chunk.fileName, chunk]));
  const closure = (roots: string[]) => {
    const seen = new Set<string>();
    const pending = [...roots];
    while (pending.length > 0) {
      const fileName = pending.pop()!;
      if (seen.has(fileName)) continue;
      seen.add(fileName);
      pending.push(...(byName.get(fileName)?.imports ?? []));
    }
    return seen;
  };
  const entries = chunks.filter((chunk) => chunk.isEntry).map((chunk) => chunk.fileName);
  const starts = [...new Set(entries.flatMap((entry) => byName.get(entry)?.dynamicImports ?? []))];
  const gzipOf = (files: Iterable<string>) => [...files].reduce((sum, file) => sum + gzipSync(byName.get(file)?.code ?? '').length, 0);
  const ways = (starts.length > 0 ? starts : [entries[0] ?? '']).map((start) => {
    const files = [...closure([...entries, start])].sort();
    return { files, gzipBytes: gzipOf(files), start };
  });
  return ways.reduce((heaviest, way) => (way.gzipBytes > heaviest.gzipBytes ? way : heaviest));
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
      const { files, gzipBytes, start } = measureInitialJs(bundle as Parameters<typeof measureInitialJs>[0]);
      const kib = gzipBytes / KIB;
      const verdict = kib <= options.budgetKiB ? 'within' : 'OVER';
      this.info(`${files.length} file(s): ${files.join(', ')}`);
      // Printed with console.log so that it shows even with --logLevel warn and is easy to grep.
      console.log(`initial JS: ${kib.toFixed(1)} KiB gzip by way of ${start} (${verdict} the ${options.budgetKiB} KiB budget)`);
      if (verdict === 'OVER') this.warn(`initial JS is over the ${options.budgetKiB} KiB gzip budget`);
    },
  };
}
