import { createRoot, type Root } from 'react-dom/client';

let root: Root | undefined;

/** The one React root on #root: the standalone sign-in renders into it first, the full app replaces it. */
export function appRoot(): Root {
  if (root) return root;
  const container = document.getElementById('root');
  if (!container) throw new Error('index.html has no #root element');
  root = createRoot(container);
  return root;
}
