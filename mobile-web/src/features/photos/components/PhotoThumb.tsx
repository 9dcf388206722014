import { useEffect, useState } from 'react';
import './PhotoThumb.css';

/** A stored or pending photo, shown from its Blob through an object URL released on unmount. */
export function PhotoThumb({ blob, alt, onRemove }: { blob: Blob; alt: string; onRemove?(): void }) {
  const [url, setUrl] = useState<string>();
  useEffect(() => {
    const objectUrl = URL.createObjectURL(blob);
    setUrl(objectUrl);
    return () => URL.revokeObjectURL(objectUrl);
  }, [blob]);

  return (
    <figure className="photo-thumb" data-testid="photo-thumb">
      {url && <img src={url} alt={alt} />}
      {onRemove && (
        <button type="button" className="photo-thumb__remove" onClick={onRemove} aria-label={`Remove ${alt}`}>
          Remove
        </button>
      )}
    </figure>
  );
}
