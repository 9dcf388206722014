/**
 * A date or number formatter made on first use. The first Intl formatter a page makes loads the
 * locale's data, tens of milliseconds on a phone; made at module top level, that cost lands in
 * the start-up task of every screen that imports the module, even one that formats nothing yet.
 */
export function lazyFormat<F extends { format(value: never): string }>(make: () => F): F['format'] {
  let formatter: F | undefined;
  return ((value: never) => (formatter ??= make()).format(value)) as F['format'];
}
