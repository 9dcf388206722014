import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);

/** The Open Sans files the app already ships (@fontsource/open-sans, latin subset); pdfkit reads .woff through fontkit. */
export const REPORT_FONTS = {
  regular: require.resolve('@fontsource/open-sans/files/open-sans-latin-400-normal.woff'),
  semibold: require.resolve('@fontsource/open-sans/files/open-sans-latin-600-normal.woff'),
  bold: require.resolve('@fontsource/open-sans/files/open-sans-latin-700-normal.woff'),
};

/** A parsed font as fontkit returns it; pdfkit (0.20+) takes one in place of a path. */
interface ParsedFont {
  layout(text: string): unknown;
}
type FontName = keyof typeof REPORT_FONTS;

// The fontkit pdfkit itself loads (its own dependency), so the parsed objects are the kind it expects.
const fontkit = createRequire(require.resolve('pdfkit'))('fontkit') as { openSync(path: string): ParsedFont };
const parsed = new Map<FontName, ParsedFont>();

/**
 * The fonts parsed once per process and shared by every report: fontkit decompresses a WOFF's
 * tables and reads its layout tables on first use (about 0.1 s a face, three faces), and keeps
 * them on the font object. Each PDF still embeds its own subset of the glyphs it used.
 */
export function reportFont(name: FontName): ParsedFont {
  let font = parsed.get(name);
  if (!font) {
    font = fontkit.openSync(REPORT_FONTS[name]);
    parsed.set(name, font);
  }
  return font;
}
