import { SIZE_UNITS } from '#shared/domain/units';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { useSizeUnit } from '@/lib/preferences';

/** Leg spans in millimetres or inches, as this person prefers (stored in mm either way). */
export function UnitPicker() {
  const [unit, setUnit] = useSizeUnit();
  return (
    <ChoiceGroup
      legend="Leg spans in"
      className="grid-cols-2"
      value={unit}
      options={SIZE_UNITS}
      onChange={setUnit}
      render={(u) => (u === 'mm' ? 'Millimetres' : 'Inches')}
    />
  );
}
