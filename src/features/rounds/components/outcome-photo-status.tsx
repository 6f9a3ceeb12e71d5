import { useOutcomePhotos, type OutcomePhoto } from '../api/outcome-photo';

const WORDS: Record<OutcomePhoto['phase'], (p: OutcomePhoto) => string> = {
  waiting: (p) =>
    `Photo with ${p.word}: waiting for a signal. Keep this page open; it is sent when the outcome reaches Rackside.`,
  sending: (p) => `Photo with ${p.word}: sending…`,
  sent: (p) => `Photo with ${p.word}: saved.`,
  failed: (p) =>
    `Photo with ${p.word} was not saved: ${p.message ?? 'try again'}. Add it from the animal’s timeline.`,
};

/** How the photos taken with this animal's outcomes are getting on (nothing when there are none). */
export function OutcomePhotoStatus({ animalId }: { animalId: string }) {
  const photos = useOutcomePhotos(animalId);
  if (!photos.length) return null;
  return (
    <ul aria-live="polite" className="flex flex-col gap-1 py-1 text-sm font-bold">
      {photos.map((p) => (
        <li key={p.eventId} className={p.phase === 'failed' ? 'text-danger' : undefined}>
          {WORDS[p.phase](p)}
        </li>
      ))}
    </ul>
  );
}
