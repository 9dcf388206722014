import { IonButton, IonIcon, IonNote } from '@ionic/react';
import { cameraOutline } from 'ionicons/icons';
import { useRef, useState } from 'react';
import { Spinner } from '../../../components/Spinner';
import { newId } from '../../../local-db/ids';
import type { PhotoRecord } from '../../../local-db/records';
import { compressPhoto } from '../compress-photo';
import { photoBlob } from '../photo-data';
import type { PendingPhoto } from '../photos.store';
import { PhotoThumb } from './PhotoThumb';

interface PhotoPickerProps {
  /** Photos already on the phone for this record. */
  stored: readonly PhotoRecord[];
  /** Photos taken in this form, saved with it. */
  pending: readonly PendingPhoto[];
  onAdd(photo: PendingPhoto): void;
  onRemovePending(id: string): void;
  label?: string;
  testId?: string;
}

/**
 * Opens the camera (`capture="environment"`: the back camera straight away on a phone), shrinks
 * the picture on the phone and hands it to the form.
 */
export function PhotoPicker({ stored, pending, onAdd, onRemovePending, label = 'Take a photo', testId }: PhotoPickerProps) {
  const input = useRef<HTMLInputElement>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string>();

  async function onFiles(files: FileList | null) {
    const file = files?.[0];
    if (!file) return;
    setBusy(true);
    setError(undefined);
    try {
      const compressed = await compressPhoto(file);
      onAdd({ id: newId(), takenAt: new Date(file.lastModified || Date.now()).toISOString(), ...compressed });
    } catch (caught) {
      setError(caught instanceof Error ? caught.message : 'The photo could not be used.');
    } finally {
      setBusy(false);
      if (input.current) input.current.value = '';
    }
  }

  const count = stored.length + pending.length;
  return (
    <div className="photo-picker" data-testid={testId} data-count={count}>
      <input
        ref={input}
        className="visually-hidden"
        type="file"
        accept="image/*"
        capture="environment"
        tabIndex={-1}
        aria-hidden="true"
        onChange={(event) => void onFiles(event.target.files)}
        data-testid={testId ? `${testId}-input` : undefined}
      />
      <IonButton fill="outline" expand="block" disabled={busy} onClick={() => input.current?.click()}>
        {busy ? <Spinner /> : <IonIcon slot="start" icon={cameraOutline} aria-hidden="true" />}
        {busy ? 'Preparing the photo…' : label}
      </IonButton>
      {error && (
        <IonNote color="danger" className="field-error" role="alert">
          {error}
        </IonNote>
      )}
      {count > 0 && (
        <div className="photo-picker__thumbs">
          {stored.map((photo, index) => (
            <PhotoThumb key={photo.id} blob={photoBlob(photo)} alt={`Photo ${index + 1}`} />
          ))}
          {pending.map((photo, index) => (
            <PhotoThumb key={photo.id} blob={photo.blob} alt={`New photo ${index + 1}`} onRemove={() => onRemovePending(photo.id)} />
          ))}
        </div>
      )}
    </div>
  );
}
