import { useState } from 'react';
import type { BuildPhoto } from '../../../../shared/api/build-log';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { ConfirmInline } from '../../../components/ui/confirm-inline';
import { describeError } from '../../../lib/api-client';
import { useDeleteBuildPhoto } from '../api/delete-build-photo';
import { photoUrl } from '../api/upload-build-photos';
import { stageLabels } from './build-words';

/** A part's photos as thumbnails (each opens the full photo), each with a Delete for whoever may remove it. */
export function PhotoStrip({ hullId, partName, photos, mayDelete }: { hullId: number; partName: string; photos: BuildPhoto[]; mayDelete: (photo: BuildPhoto) => boolean }) {
  const remove = useDeleteBuildPhoto(hullId);
  const [asking, setAsking] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  if (photos.length === 0) return null;

  const confirm = async (photoId: number) => {
    setError(null);
    try {
      await remove.mutateAsync(photoId);
      setAsking(null);
    } catch (err) {
      setError(describeError(err));
    }
  };

  return (
    <div className="flex flex-col gap-2">
      <ul aria-label="Photos" className="flex flex-wrap gap-3">
        {photos.map((p) => {
          const alt = `${partName}${p.stage ? `, ${stageLabels[p.stage].toLowerCase()}` : ''}, by ${p.uploader.displayName}`;
          return (
            <li key={p.id} className="flex flex-col gap-2">
              <a href={photoUrl(hullId, p.id, 'full')} target="_blank" rel="noreferrer">
                <img src={photoUrl(hullId, p.id, 'thumb')} width={p.thumbWidth} height={p.thumbHeight} alt={alt} className="h-32 w-auto rounded border border-rule" />
              </a>
              {mayDelete(p) &&
                (asking === p.id ? (
                  <ConfirmInline
                    question="Delete this photo for the whole crew? It cannot be brought back."
                    confirmLabel="Delete photo"
                    busy={remove.isPending}
                    onConfirm={() => void confirm(p.id)}
                    onCancel={() => setAsking(null)}
                  />
                ) : (
                  <Button variant="secondary" aria-label={`Delete photo: ${alt}`} onClick={() => setAsking(p.id)}>
                    Delete
                  </Button>
                ))}
            </li>
          );
        })}
      </ul>
      {error && <Alert tone="error">{error}</Alert>}
    </div>
  );
}
