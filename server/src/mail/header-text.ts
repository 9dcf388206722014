/** User text made safe for a header: no line breaks or control characters, bounded length. */
export function headerText(value: string, max = 120): string {
  const flat = value.replace(/[\u0000-\u001f\u007f\u2028\u2029]+/g, ' ').replace(/\s+/g, ' ').trim();
  return flat.length > max ? `${flat.slice(0, max - 1)}…` : flat;
}
