import { useId, type ReactNode } from 'react';

interface Props<T extends string> {
  legend: string;
  /** Hide the legend when the choices say enough on their own. */
  legendHidden?: boolean;
  value: T;
  options: readonly T[];
  onChange: (value: T) => void;
  render: (option: T) => ReactNode;
  className?: string;
}

/** Large chips that behave as one radio group: exactly one is chosen, keyboard works as usual. */
export function ChoiceGroup<T extends string>({
  legend,
  legendHidden,
  value,
  options,
  onChange,
  render,
  className = '',
}: Props<T>) {
  const name = useId();
  return (
    <fieldset className={`grid gap-1 ${className}`}>
      <legend className={legendHidden ? 'sr-only' : 'mb-1 font-bold'}>{legend}</legend>
      {options.map((option) => (
        <label
          key={option}
          className={`flex min-h-target cursor-pointer flex-col items-center justify-center rounded-xl border-2 px-1 text-center text-sm font-bold leading-tight has-[:focus-visible]:outline has-[:focus-visible]:outline-4 ${value === option ? 'border-text bg-text text-bg' : 'border-border bg-surface text-text'}`}
        >
          <input
            type="radio"
            name={name}
            value={option}
            checked={value === option}
            onChange={() => onChange(option)}
            className="sr-only"
          />
          {render(option)}
        </label>
      ))}
    </fieldset>
  );
}
