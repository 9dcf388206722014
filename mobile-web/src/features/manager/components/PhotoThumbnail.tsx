import { useEffect, useState } from 'react';
import { fetchPhotoThumbnail } from '../manager.api';

/** A photo's thumbnail, fetched with the access token; the object URL is released on unmount. */
export function PhotoThumbnail({ photoId, alt }: { photoId: string; alt: string }) {
  const [url, setUrl] = useState<string | null>(null);
  const [failed, setFailed] = useState(false);
  useEffect(() => {
    let current: string | null = null;
    let live = true;
    fetchPhotoThumbnail(photoId).then(
      (u) => (live ? setUrl((current = u)) : URL.revokeObjectURL(u)),
      () => live && setFailed(true),
    );
    return () => {
      live = false;
      if (current) URL.revokeObjectURL(current);
    };
  }, [photoId]);
  if (failed) return <span>Photo not available offline</span>;
  return url ? <img src={url} alt={alt} width={160} height={120} style={{ objectFit: 'cover', borderRadius: 6 }} /> : <span>Loading photo…</span>;
}
