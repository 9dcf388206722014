import { IonButton } from '@ionic/react';
import { useEffect, useRef, useState, type PointerEvent } from 'react';
import './SignaturePad.css';

/** The drawing's own coordinate box; the stored path is in these units whatever the screen size. */
const BOX_WIDTH = 600;
const BOX_HEIGHT = 200;

type Point = [number, number];

/** SVG path data of the strokes, e.g. "M12.5 40L13 41.5…", rounded to 0.5 units. */
export function strokesToPath(strokes: readonly Point[][]): string {
  const r = (v: number) => Math.round(v * 2) / 2;
  return strokes
    .filter((stroke) => stroke.length > 0)
    .map((stroke) => stroke.map(([x, y], i) => `${i === 0 ? 'M' : 'L'}${r(x)} ${r(y)}`).join(''))
    .join('');
}

interface SignaturePadProps {
  value: string | null;
  onChange(path: string | null): void;
}

/** An optional drawn signature (the typed name and position are the signature of record). */
export function SignaturePad({ value, onChange }: SignaturePadProps) {
  const surface = useRef<SVGSVGElement>(null);
  const [strokes, setStrokesState] = useState<Point[][]>([]);
  const latest = useRef<Point[][]>([]);
  const drawing = useRef(false);

  function setStrokes(next: Point[][]) {
    latest.current = next;
    setStrokesState(next);
  }

  useEffect(() => {
    if (value === null && latest.current.length > 0) setStrokes([]);
  }, [value]);

  function point(event: PointerEvent<SVGSVGElement>): Point {
    const rect = surface.current!.getBoundingClientRect();
    return [((event.clientX - rect.left) / rect.width) * BOX_WIDTH, ((event.clientY - rect.top) / rect.height) * BOX_HEIGHT];
  }

  function down(event: PointerEvent<SVGSVGElement>) {
    event.currentTarget.setPointerCapture(event.pointerId);
    drawing.current = true;
    setStrokes([...latest.current, [point(event)]]);
  }

  function move(event: PointerEvent<SVGSVGElement>) {
    if (!drawing.current) return;
    const p = point(event);
    const all = latest.current;
    setStrokes([...all.slice(0, -1), [...(all.at(-1) ?? []), p]]);
  }

  function up() {
    if (!drawing.current) return;
    drawing.current = false;
    onChange(strokesToPath(latest.current) || null);
  }

  const path = strokes.length > 0 ? strokesToPath(strokes) : (value ?? '');
  return (
    <div className="signature-pad">
      <svg
        ref={surface}
        className="signature-pad__surface"
        viewBox={`0 0 ${BOX_WIDTH} ${BOX_HEIGHT}`}
        role="img"
        aria-label={path ? 'Your drawn signature' : 'Signature area: draw with your finger'}
        onPointerDown={down}
        onPointerMove={move}
        onPointerUp={up}
        onPointerCancel={up}
        data-testid="signature-pad"
      >
        <line x1="24" y1={BOX_HEIGHT - 40} x2={BOX_WIDTH - 24} y2={BOX_HEIGHT - 40} stroke="#b9b2c2" strokeWidth="2" />
        {path && <path d={path} fill="none" stroke="#1c1424" strokeWidth="4" strokeLinecap="round" strokeLinejoin="round" />}
      </svg>
      <IonButton fill="clear" size="default" disabled={!path} onClick={() => { setStrokes([]); onChange(null); }}>
        Clear the drawing
      </IonButton>
    </div>
  );
}
