import { codeKey, type LabelReading } from '#shared/domain/labels/label-payload';
import type { AnimalSummary } from '#shared/schemas/animals';
import type { MembershipSummary } from '#shared/schemas/auth';
import type { RoundItemView } from '#shared/schemas/rounds';

/** What a scan or a typed code leads to, before anything is shown. */
export type LabelTarget =
  | { kind: 'on_round'; item: RoundItemView }
  /** In the collection but not on today's round: recorded only if the keeper says so. */
  | { kind: 'not_due'; item: RoundItemView }
  /** The person's own other collection (id and name), or one they are not in (nulls). */
  | { kind: 'other_collection'; collectionId: string | null; collectionName: string | null }
  | { kind: 'unknown_code'; code: string }
  /** A helper sees only today's round, so an animal off it cannot be looked up. */
  | { kind: 'not_on_round'; code: string }
  /** A keeper's phone that has never had the animal list (first use with no signal). */
  | { kind: 'list_missing'; code: string }
  | { kind: 'malformed' }
  | { kind: 'foreign' };

interface Context {
  collection: Pick<MembershipSummary, 'labelTag'>;
  memberships: readonly Pick<MembershipSummary, 'labelTag' | 'collectionName' | 'collectionId'>[];
  roundItems: readonly RoundItemView[];
  /** The collection's animals; null where the person may not list them (helpers); undefined
   * while this phone has no copy. */
  animals: readonly AnimalSummary[] | null | undefined;
}

/** An animal off today's round shown like a round item with no tasks. */
export function offRoundItem(a: AnimalSummary): RoundItemView {
  const { id, labelCode, name, scientificName, group, lifeStage, sex, cautions, location } = a;
  return {
    animal: { id, labelCode, name, scientificName, group, lifeStage, sex, cautions, location },
    tasks: [],
    notes: [],
    carriedOverDays: 0,
    addedDuringDay: false,
    outcomes: [],
    warnings: [],
  };
}

export function resolveLabel(reading: LabelReading, ctx: Context): LabelTarget {
  if (reading.kind === 'malformed' || reading.kind === 'foreign') return reading;
  if (reading.kind === 'label' && reading.tag !== ctx.collection.labelTag) {
    const other = ctx.memberships.find((m) => m.labelTag === reading.tag);
    return {
      kind: 'other_collection',
      collectionId: other?.collectionId ?? null,
      collectionName: other?.collectionName ?? null,
    };
  }
  const key = codeKey(reading.code);
  const item = ctx.roundItems.find((i) => codeKey(i.animal.labelCode) === key);
  if (item) return { kind: 'on_round', item };
  if (ctx.animals === null) return { kind: 'not_on_round', code: reading.code };
  if (ctx.animals === undefined) return { kind: 'list_missing', code: reading.code };
  const animal = ctx.animals.find((a) => codeKey(a.labelCode) === key);
  return animal
    ? { kind: 'not_due', item: offRoundItem(animal) }
    : { kind: 'unknown_code', code: reading.code };
}

/** How the label came in: its QR (camera, photo, a typed code) or an NFC tag. */
export type LabelSource = 'qr' | 'nfc';

/** Plain words for the targets that do not open an animal. */
export function targetMessage(
  target: Exclude<LabelTarget, { kind: 'on_round' | 'not_due' }>,
  via: LabelSource = 'qr',
): {
  title: string;
  body: string;
} {
  switch (target.kind) {
    case 'other_collection':
      return target.collectionName
        ? {
            title: `This label belongs to ${target.collectionName}.`,
            body: 'Switch to that collection to record for it.',
          }
        : {
            title: 'This label belongs to another collection.',
            body: 'It was printed for a collection you are not part of.',
          };
    case 'unknown_code':
      return {
        title: `No animal here has the code ${target.code}.`,
        body: 'Check the code on the label. A label that was replaced by a new code no longer works.',
      };
    case 'not_on_round':
      return {
        title: `${target.code} is not on today’s round.`,
        body: 'Helpers record for the animals on the round. Leave a note for the keeper if something needs doing.',
      };
    case 'list_missing':
      return {
        title: `${target.code} is not on today’s round.`,
        body: 'This phone has no copy of the animal list yet. Open the app once with a signal, then it works offline too.',
      };
    case 'malformed':
      if (via === 'nfc')
        return {
          title: 'This tag holds a damaged label address.',
          body: 'Write the tag again from the animal’s page, or scan the QR label.',
        };
      return {
        title: 'That is not a label code.',
        body: 'Codes look like NL-7K3: letters and digits, no O, 0, I or 1. A damaged label can be typed in instead.',
      };
    case 'foreign':
      if (via === 'nfc')
        return {
          title: 'That tag is not a Rackside tag.',
          body: 'It holds no Rackside label address. Tags written from an animal’s page or the Labels page open the animal; so does the QR label.',
        };
      return {
        title: 'That QR code is not a Rackside label.',
        body: 'Point the camera at the label on the enclosure.',
      };
  }
}
