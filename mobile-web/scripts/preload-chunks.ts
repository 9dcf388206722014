import { fileURLToPath } from 'node:url';
import type { Plugin } from 'vite';

interface ChunkLike {
  type: 'chunk';
  fileName: string;
  moduleIds: string[];
  imports: string[];
  viteMetadata?: { importedCss: Set<string> };
}

interface AssetLike {
  type: 'asset';
  source: string | Uint8Array;
}

/**
 * Adds <link rel="modulepreload"> to `page` for the chunks holding `modules` (and what they
 * import), code the app loads on demand but every start needs soon after (the session, read by
 * every screen, with the local database). The download then starts with the page's own scripts
 * instead of after them; the code still runs only when imported, and stays out of the entry.
 *
 * Their stylesheets go into the page, as the entry's do (inline-entry-css.ts): a <style> and a
 * disabled <link> that tells Vite's loader the sheet is there. The loader would otherwise add a
 * <link> for each when the chunk is imported, and adding them cost the phone a long task there.
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
          .map((fileName) => `<link rel="modulepreload" crossorigin href="/${fileName}">`);
        const sheets = [...new Set([...files].flatMap((fileName) => [...(byName.get(fileName)?.viteMetadata?.importedCss ?? [])]))]
          .filter((fileName) => !html.includes(`/${fileName}"`))
          .map((fileName) => {
            const asset = (bundle as unknown as Record<string, AssetLike | undefined>)[fileName];
            if (asset?.type !== 'asset') throw new Error(`preload-chunks: ${fileName} is not in the build`);
            const css = typeof asset.source === 'string' ? asset.source : new TextDecoder().decode(asset.source);
            // Inlined, a relative url() would point elsewhere, and a sheet cannot end the <style> early.
            if (/url\(|<\/style/i.test(css)) throw new Error(`${fileName} has a url() or "</style"; it cannot be inlined`);
            return `<style>${css.trim()}</style>\n    <link rel="stylesheet" href="/${fileName}" disabled>`;
          });
        const added = [...links, ...sheets].join('\n    ');
        return added ? html.replace('</head>', `  ${added}\n  </head>`) : html;
      },
    },
  };
}
