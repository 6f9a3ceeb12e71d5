import type { TaskKind } from '#shared/domain/rounds/build-round';
import type { Offer } from '#shared/domain/rounds/rules';
import {
  CheckIcon,
  FeedIcon,
  LeaveAloneIcon,
  MistIcon,
  MoistenIcon,
  RehouseIcon,
  RemovePreyIcon,
  SpotCleanIcon,
  WaterIcon,
} from '@/components/ui/icons';

/** Each task has its own symbol and word (never colour alone). */
export const TASK_META: Record<TaskKind, { word: string; Icon: typeof FeedIcon }> = {
  remove_prey: { word: 'Remove prey', Icon: RemovePreyIcon },
  leave_alone: { word: 'Leave alone', Icon: LeaveAloneIcon },
  feed: { word: 'Feed', Icon: FeedIcon },
  water: { word: 'Water', Icon: WaterIcon },
  mist: { word: 'Mist', Icon: MistIcon },
  moisten: { word: 'Moisten substrate', Icon: MoistenIcon },
  spot_clean: { word: 'Spot-clean', Icon: SpotCleanIcon },
  rehouse: { word: 'Rehouse', Icon: RehouseIcon },
  check: { word: 'Check', Icon: CheckIcon },
};

/** "1–3 large cricket", "1 tiny fruit-fly larvae". */
export function describeOffer(offer: Offer): string {
  const count =
    offer.countMin === offer.countMax ? `${offer.countMin}` : `${offer.countMin}–${offer.countMax}`;
  return `${count} × ${offer.preySize} ${offer.preyType}`;
}
