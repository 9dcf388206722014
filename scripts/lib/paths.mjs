import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
export const DATA_DIR = process.env.PLUMMET_DATA_DIR ? resolve(process.env.PLUMMET_DATA_DIR) : resolve(ROOT, '.data');
