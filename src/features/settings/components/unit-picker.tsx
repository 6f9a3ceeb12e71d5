import { TEMPERATURE_SYMBOL, TEMPERATURE_UNITS } from '#shared/domain/temperature';
import { SIZE_UNITS } from '#shared/domain/units';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { Notice } from '@/components/ui/notice';
import { useSizeUnit, useTemperatureUnit } from '@/lib/preferences';
import { useSaveTemperatureUnit } from '../api/preferences';

/**
 * The person's units: leg spans in millimetres or inches (stored in mm either way), kept on
 * this device like the theme, and temperatures in °C or °F (stored in °C either way), the
 * person's own setting on the server (their e-mails use it); this device follows it at once.
 */
export function UnitPicker() {
  const [unit, setUnit] = useSizeUnit();
  const [temperature, setTemperature] = useTemperatureUnit();
  const save = useSaveTemperatureUnit();
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
        onChange={(u) => {
          setTemperature(u);
          save.mutate(u);
        }}
        render={(u) => (
          <>
            <span>{u === 'C' ? 'Celsius' : 'Fahrenheit'}</span>
            <span aria-hidden="true">{TEMPERATURE_SYMBOL[u]}</span>
          </>
        )}
      />
      {save.isError && (
        <Notice
          tone="error"
          title={`Shown in ${TEMPERATURE_SYMBOL[temperature]} on this phone only: your account still has the old unit (${save.error.message}). Choose again when you have signal.`}
        />
      )}
    </div>
  );
}
