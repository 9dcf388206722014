import { useLiveQuery } from 'dexie-react-hooks';
import { db } from '../../../local-db/db';
import { photoBlob } from '../../photos/photo-data';
import { PhotoThumb } from '../../photos/components/PhotoThumb';
import { photosOf } from '../../photos/photos.store';

/** The inspector's first photo of a finding, when its picture is on this phone; a plain box otherwise. */
export function FindingThumb({ findingId, alt }: { findingId: string; alt: string }) {
  const photo = useLiveQuery(async () => (await photosOf(db, 'finding', findingId))[0] ?? null, [findingId]);
  if (!photo) return <span className="fix-row__no-photo" aria-hidden="true" />;
  return <PhotoThumb blob={photoBlob(photo)} alt={alt} />;
}
