import { TEMPERATURE_SYMBOL, TEMPERATURE_UNITS } from '#shared/domain/temperature';
import { SIZE_UNITS } from '#shared/domain/units';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { useSizeUnit, useTemperatureUnit } from '@/lib/preferences';

/**
 * The person's units: leg spans in millimetres or inches (stored in mm either way) and
 * temperatures in °C or °F (stored in °C either way), kept on this device like the theme.
 */
export function UnitPicker() {
  const [unit, setUnit] = useSizeUnit();
  const [temperature, setTemperature] = useTemperatureUnit();
  return (
    <div className="flex flex-col gap-4">
      <ChoiceGroup
        legend="Leg spans in"
        className="grid-cols-2"
        value={unit}
        options={SIZE_UNITS}
        onChange={setUnit}
        render={(u) => (u === 'mm' ? 'Millimetres' : 'Inches')}
      />
      <ChoiceGroup
        legend="Temperatures in"
        className="grid-cols-2"
        value={temperature}
        options={TEMPERATURE_UNITS}
        onChange={setTemperature}
        render={(u) => (
          <>
            <span>{u === 'C' ? 'Celsius' : 'Fahrenheit'}</span>
            <span aria-hidden="true">{TEMPERATURE_SYMBOL[u]}</span>
          </>
        )}
      />
    </div>
  );
}
