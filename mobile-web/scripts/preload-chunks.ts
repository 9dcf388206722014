import { fileURLToPath } from 'node:url';
import type { Plugin } from 'vite';

interface ChunkLike {
  type: 'chunk';
  fileName: string;
  moduleIds: string[];
  imports: string[];
}

/**
 * Adds <link rel="modulepreload"> to `page` for the chunks holding `modules` (and what they
 * import), code the app loads on demand but every start needs soon after (the session, read by
 * every screen, with the local database). The download then starts with the page's own scripts
 * instead of after them; the code still runs only when imported, and stays out of the entry.
 */
export function preloadChunks(options: { page: string; modules: URL[] }): Plugin {
  const wanted = options.modules.map((url) => fileURLToPath(url));
  return {
    name: 'plummet:preload-chunks',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler(html, { bundle, path }) {
        if (!bundle || path !== `/${options.page}`) return html;
        const chunks = Object.values(bundle).filter((item): item is ChunkLike & (typeof bundle)[string] => item.type === 'chunk') as unknown as ChunkLike[];
        const byName = new Map(chunks.map((chunk) => [chunk.fileName, chunk]));
        const files = new Set<string>();
        const pending = chunks.filter((chunk) => chunk.moduleIds.some((id) => wanted.includes(id))).map((chunk) => chunk.fileName);
        if (pending.length < wanted.length) throw new Error(`preload-chunks: no chunk holds one of ${wanted.join(', ')}`);
        while (pending.length > 0) {
          const fileName = pending.pop()!;
          if (files.has(fileName)) continue;
          files.add(fileName);
          pending.push(...(byName.get(fileName)?.imports ?? []));
        }
        const links = [...files]
          .filter((fileName) => !html.includes(`/${fileName}"`))
          .map((fileName) => `<link rel="modulepreload" crossorigin href="/${fileName}">`)
          .join('\n    ');
        return links ? html.replace('</head>', `  ${links}\n  </head>`) : html;
      },
    },
  };
}
