import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);

/** The Open Sans files the app already ships (@fontsource/open-sans, latin subset); pdfkit reads .woff through fontkit. */
export const REPORT_FONTS = {
  regular: require.resolve('@fontsource/open-sans/files/open-sans-latin-400-normal.woff'),
  semibold: require.resolve('@fontsource/open-sans/files/open-sans-latin-600-normal.woff'),
  bold: require.resolve('@fontsource/open-sans/files/open-sans-latin-700-normal.woff'),
};
