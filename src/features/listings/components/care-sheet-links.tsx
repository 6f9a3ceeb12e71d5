/** Downloads for the buyer: the care sheet PDF and the animal's history as CSV. */
export function CareSheetLinks({
  collectionId,
  animalId,
}: {
  collectionId: string;
  animalId: string;
}) {
  const base = `/api/collections/${collectionId}/animals/${animalId}`;
  const link =
    'inline-flex min-h-target items-center justify-center rounded-xl border-2 border-border bg-surface px-2 text-center font-bold underline underline-offset-4';
  return (
    <div className="grid grid-cols-2 gap-2">
      <a className={link} href={`${base}/care-sheet.pdf`} download>
        Care sheet (PDF)
      </a>
      <a className={link} href={`${base}/history.csv`} download>
        History (CSV)
      </a>
    </div>
  );
}
