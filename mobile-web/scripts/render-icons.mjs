// One-off: renders the PNG app icons from public/icons/plummet.svg (the committed source).
// Run from the repo root with `node mobile-web/scripts/render-icons.mjs` after editing the SVG,
// then commit the PNGs. sharp comes from the server workspace (hoisted to the root node_modules).
import { readFile } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';
import sharp from 'sharp';

const iconsDir = fileURLToPath(new URL('../public/icons/', import.meta.url));
const source = await readFile(`${iconsDir}plummet.svg`, 'utf8');

const backdropColour = /<rect id="backdrop"[^>]*fill="([^"]+)"/.exec(source)?.[1];
const glyph = /<g id="glyph">[\s\S]*?<\/g>/.exec(source)?.[0];
if (!backdropColour || !glyph) throw new Error('plummet.svg needs <rect id="backdrop" fill=…> and <g id="glyph">');

/**
 * Maskable and Apple icons must be full-bleed squares (the platform cuts its own shape), with the
 * mark inside the central safe circle of radius 0.4 × size (W3C manifest "maskable" purpose).
 */
function fullBleedSvg(glyphScale) {
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 512 512" width="512" height="512">
  <rect width="512" height="512" fill="${backdropColour}"/>
  <g transform="translate(256 256) scale(${glyphScale}) translate(-256 -251)">${glyph}</g>
</svg>`;
}

const outputs = [
  { file: 'icon-192.png', size: 192, svg: source },
  { file: 'icon-512.png', size: 512, svg: source },
  { file: 'maskable-192.png', size: 192, svg: fullBleedSvg(0.78) },
  { file: 'maskable-512.png', size: 512, svg: fullBleedSvg(0.78) },
  { file: 'apple-touch-icon.png', size: 180, svg: fullBleedSvg(0.86) },
];

for (const { file, size, svg } of outputs) {
  await sharp(Buffer.from(svg), { density: 72 * (size / 512) * 4 })
    .resize(size, size)
    .png({ compressionLevel: 9 })
    .toFile(`${iconsDir}${file}`);
  console.log(`wrote public/icons/${file} (${size}×${size})`);
}
