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
  /** Files the phone downloads before the app can run: the entry chunk and its static imports. */
  files: string[];
  /** Sum of each file gzipped on its own (zlib default level, as a typical server sends it), in bytes. */
  gzipBytes: number;
}

/** Walks the entry chunk's static imports; dynamic imports load later and do not count. */
export function measureInitialJs(bundle: Record<string, ChunkLike | { type: 'asset' }>): InitialJsReport {
  const chunks = Object.values(bundle).filter((item): item is ChunkLike => item.type === 'chunk');
  const byName = new Map(chunks.map((chunk) => [chunk.fileName, chunk]));
  const seen = new Set<string>();
  const pending = chunks.filter((chunk) => chunk.isEntry).map((chunk) => chunk.fileName);
  while (pending.length > 0) {
    const fileName = pending.pop()!;
    if (seen.has(fileName)) continue;
    seen.add(fileName);
    pending.push(...(byName.get(fileName)?.imports ?? []));
  }
  const files = [...seen].sort();
  const gzipBytes = files.reduce((sum, file) => sum + gzipSync(byName.get(file)?.code ?? '').length, 0);
  return { files, gzipBytes };
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
      const { files, gzipBytes } = measureInitialJs(bundle as Parameters<typeof measureInitialJs>[0]);
      const kib = gzipBytes / KIB;
      const verdict = kib <= options.budgetKiB ? 'within' : 'OVER';
      this.info(`${files.length} file(s): ${files.join(', ')}`);
      // Printed with console.log so that it shows even with --logLevel warn and is easy to grep.
      console.log(`initial JS: ${kib.toFixed(1)} KiB gzip (${verdict} the ${options.budgetKiB} KiB budget)`);
      if (verdict === 'OVER') this.warn(`initial JS is over the ${options.budgetKiB} KiB gzip budget`);
    },
  };
}
