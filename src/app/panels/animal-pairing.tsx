import { canPair } from '#shared/domain/breeding';
import { localDateOf } from '#shared/domain/local-dates';
import type { AnimalSummary } from '#shared/schemas/animals';
import { PairingForm } from '@/features/breeding/components/pairing-form';
import { useRecordOutcome, type Recorder } from '@/features/rounds/api/record-outcome';

interface Props {
  recorder: Recorder;
  female: AnimalSummary;
  /** The collection's animals, for the males she may be paired with. */
  animals: AnimalSummary[];
  timeZone: string;
}

/**
 * A pairing (breeding records) for a kept adult female of a group that breeds, with the collection's
 * active males of her group (animals), recorded as a fact like a tap (rounds).
 */
export function AnimalPairing({ recorder, female, animals, timeZone }: Props) {
  const record = useRecordOutcome(recorder);
  if (female.status !== 'active' || !canPair(female)) return null;
  const males = animals.filter(
    (a) =>
      a.status === 'active' &&
      a.group === female.group &&
      (a.sex === 'male' || a.sex === 'mature_male'),
  );
  return (
    <PairingForm
      today={localDateOf(new Date(), timeZone)}
      timeZone={timeZone}
      males={males}
      onRecord={(payload, at) => record(female, 'paired', payload, at)}
    />
  );
}
