/**
 * CSV cells for exports: quoting (RFC 4180) and neutralising cells a spreadsheet would read as a
 * formula. OWASP "CSV Injection" lists the leading characters `=`, `+`, `-`, `@`, tab and carriage
 * return, and advises prefixing such a cell with a single quote so it is read as text.
 */
const FORMULA_START = /^[=+\-@\t\r]/;

/** A text cell as a spreadsheet will read it safely: formula starts get a leading `'`. */
export function neutraliseCell(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/** One cell, quoted when it holds a comma, quote or line break. Numbers are written as they are (a negative number is a number, not a formula). */
export function csvCell(value: string | number | boolean | null | undefined): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  const text = neutraliseCell(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** One line of cells, ended with CRLF as RFC 4180 asks. */
export function csvLine(cells: readonly (string | number | boolean | null | undefined)[]): string {
  return `${cells.map(csvCell).join(',')}\r\n`;
}
