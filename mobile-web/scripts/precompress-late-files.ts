import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
import type { Plugin } from 'vite';

/**
 * vite-plugin-compression2 compresses what the bundler emits; the service worker and workbox's
 * runtime are written later, by vite-plugin-pwa's closeBundle. This compresses those top-level
 * files the same way (brotli 11, gzip 9) once everything is on disk.
 */
export function precompressLateFiles(options: { outDir: string; threshold: number }): Plugin {
  return {
    name: 'plummet:precompress-late-files',
    apply: 'build',
    enforce: 'post',
    closeBundle: {
      order: 'post',
      sequential: true,
      handler() {
        for (const name of readdirSync(options.outDir)) {
          const file = join(options.outDir, name);
          if (!/\.(js|webmanifest|json|html)$/.test(name) || existsSync(`${file}.br`)) continue;
          if (statSync(file).size < options.threshold) continue;
          const content = readFileSync(file);
          writeFileSync(`${file}.br`, brotliCompressSync(content, { params: { [constants.BROTLI_PARAM_QUALITY]: 11 } }));
          writeFileSync(`${file}.gz`, gzipSync(content, { level: 9 }));
        }
      },
    },
  };
}
