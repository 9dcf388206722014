import type { Plugin } from 'vite';

/**
 * Puts each page's own stylesheet into the page (a <style> where Vite wrote a <link>), so the first
 * paint waits for no second request. The CSS file stays in the build: code loaded later (a page
 * started from another entry) may still ask for it. The page keeps a disabled <link> to it, which
 * loads nothing but tells Vite's loader of on-demand chunks that the sheet is already there: it
 * would otherwise add a second copy of it when a chunk that needs it loads (every rule twice, and
 * the whole page's style worked out again when the copy arrives).
 */
export function inlineEntryCss(): Plugin {
  return {
    name: 'plummet:inline-entry-css',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler(html, { bundle }) {
        if (!bundle) return html;
        return html.replace(/<link rel="stylesheet"(?: crossorigin)? href="\/([^"]+\.css)">/g, (link, fileName: string) => {
          const asset = bundle[fileName];
          if (asset?.type !== 'asset') return link;
          const css = typeof asset.source === 'string' ? asset.source : new TextDecoder().decode(asset.source);
          // A stylesheet cannot end the <style> element early; say so loudly if one ever tries.
          if (/<\/style/i.test(css)) throw new Error(`${fileName} contains "</style"; it cannot be inlined`);
          return `<style>${css.trim()}</style>\n    <link rel="stylesheet" href="/${fileName}" disabled>`;
        });
      },
    },
  };
}
