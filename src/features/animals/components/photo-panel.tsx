import { useId } from 'react';
import type { AnimalSummary } from '#shared/schemas/animals';
import { Notice } from '@/components/ui/notice';
import { useUploadPhoto } from '../api/animal-records';

export const photoUrl = (
  collectionId: string,
  a: Pick<AnimalSummary, 'id' | 'photoVersion'>,
  size: 'thumb' | 'full',
) =>
  `/api/collections/${collectionId}/animals/${a.id}/photo?size=${size}&v=${encodeURIComponent(a.photoVersion ?? '')}`;

/** The animal's photo, and a new one from the camera or a file (keepers). */
export function PhotoPanel({
  collectionId,
  animal,
  canChange,
}: {
  collectionId: string;
  animal: AnimalSummary;
  canChange: boolean;
}) {
  const inputId = useId();
  const upload = useUploadPhoto(collectionId, animal.id);
  return (
    <section
      aria-label="Photo"
      className={
        animal.photoVersion
          ? 'flex flex-col gap-2'
          : 'flex flex-wrap items-center justify-between gap-2 rounded-2xl border-2 border-dashed border-border p-2'
      }
    >
      {animal.photoVersion ? (
        <a
          href={photoUrl(collectionId, animal, 'full')}
          className="block overflow-hidden rounded-2xl border-2 border-border"
        >
          <img
            src={photoUrl(collectionId, animal, 'thumb')}
            alt={`${animal.name}, ${animal.scientificName}`}
            className="aspect-[4/3] w-full object-cover"
          />
        </a>
      ) : (
        <p className="text-muted">No photo yet.</p>
      )}
      {canChange && (
        <label
          htmlFor={inputId}
          className="flex min-h-target cursor-pointer items-center justify-center rounded-xl border-2 border-border bg-surface px-4 text-lg font-bold has-[:focus-visible]:outline has-[:focus-visible]:outline-4"
        >
          {upload.isPending
            ? 'Sending the photo…'
            : animal.photoVersion
              ? 'Change the photo'
              : 'Add a photo'}
          <input
            id={inputId}
            type="file"
            accept="image/jpeg,image/png,image/webp"
            capture="environment"
            className="sr-only"
            onChange={(e) => {
              const file = e.target.files?.[0];
              if (file) upload.mutate(file);
              e.target.value = '';
            }}
          />
        </label>
      )}
      {upload.isError && <Notice tone="error" title={upload.error.message} />}
    </section>
  );
}
