/** A small busy indicator of our own (CSS only, no component to load). */
export function Spinner() {
  return <span className="spinner" aria-hidden="true" />;
}
