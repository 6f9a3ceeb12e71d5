/**
 * Room temperatures and humidity, as the climate screens and the round will show them.
 *
 * Temperatures are stored in degrees Celsius and shown in the person's unit (°C or °F, a setting
 * of their own) to one decimal place. The conversion is exact by definition:
 * t/°F = 1.8 · t/°C + 32 (NIST Special Publication 811, 2008 edition, "Guide for the Use of the
 * International System of Units (SI)", section 4.2.1.1 and Appendix B.9 — the section numbers
 * from memory). Temperature differences (a range's width, an alarm margin) convert with the
 * factor alone: Δt/°F = 1.8 · Δt/°C.
 */

export const TEMPERATURE_UNITS = ['C', 'F'] as const;
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];

export const TEMPERATURE_SYMBOL: Record<TemperatureUnit, string> = { C: '°C', F: '°F' };

/** 1 °C of difference is 1.8 °F of difference (NIST SP 811, 2008, Appendix B.9). */
export const FAHRENHEIT_PER_CELSIUS = 1.8;
/** The Fahrenheit reading at 0 °C (NIST SP 811, 2008, 4.2.1.1). */
export const FAHRENHEIT_AT_ZERO_CELSIUS = 32;

/** Exact conversions (no rounding): what a store or a chart's axis needs. */
export function celsiusToFahrenheit(celsius: number): number {
  return FAHRENHEIT_PER_CELSIUS * celsius + FAHRENHEIT_AT_ZERO_CELSIUS;
}

export function fahrenheitToCelsius(fahrenheit: number): number {
  return (fahrenheit - FAHRENHEIT_AT_ZERO_CELSIUS) / FAHRENHEIT_PER_CELSIUS;
}

/**
 * Rounds half away from zero at `digits` places, on the decimal text rather than the binary
 * value, so 79.65 shows as 79.7 (binary 79.65 is a shade under it) and −0.05 as −0.1, not −0.
 */
function roundTo(value: number, digits: number): number {
  const scaled = Number(`${Math.abs(value).toFixed(digits + 6)}e${digits}`);
  const rounded = Math.round(scaled) / 10 ** digits;
  return rounded === 0 ? 0 : Math.sign(value) * rounded;
}

/**
 * What is stored: °C to a hundredth. A hundredth of a degree Celsius is 0.018 °F, well under the
 * half tenth that one-decimal display rounds away, so a value typed in °F to a tenth comes back
 * exactly as typed (the round-trip test proves it over the whole range a room can have).
 */
export const STORED_CELSIUS_DIGITS = 2;

/** What a person typed, in their unit, as the °C to store. */
export function temperatureToCelsius(value: number, unit: TemperatureUnit): number {
  return roundTo(unit === 'C' ? value : fahrenheitToCelsius(value), STORED_CELSIUS_DIGITS);
}

/** A stored °C value in the person's unit to one decimal: for a form field or a chart label. */
export function temperatureInUnit(celsius: number, unit: TemperatureUnit): number {
  return roundTo(unit === 'C' ? celsius : celsiusToFahrenheit(celsius), 1);
}

/** A stored difference in °C (a range's width) in the person's unit, to one decimal. */
export function temperatureDifferenceInUnit(deltaCelsius: number, unit: TemperatureUnit): number {
  return roundTo(unit === 'C' ? deltaCelsius : FAHRENHEIT_PER_CELSIUS * deltaCelsius, 1);
}

/** One decimal in the person's locale ("26,5" in German), with a true minus sign. */
function oneDecimal(value: number, locale: string | undefined): string {
  return new Intl.NumberFormat(locale, {
    minimumFractionDigits: 1,
    maximumFractionDigits: 1,
  })
    .format(value)
    .replace('-', '−');
}

/**
 * A stored °C value as people read it: "26.5 °C", "79.7 °F", "—" when there is no reading.
 * SI Brochure (9th edition, 2019, 5.4.3 — from memory): a space between the number and °C.
 */
export function formatTemperature(
  celsius: number | null,
  unit: TemperatureUnit,
  locale?: string,
): string {
  if (celsius === null) return '—';
  return `${oneDecimal(temperatureInUnit(celsius, unit), locale)} ${TEMPERATURE_SYMBOL[unit]}`;
}

/** A target range as one phrase: "24.0–28.0 °C". */
export function formatTemperatureRange(
  minCelsius: number,
  maxCelsius: number,
  unit: TemperatureUnit,
  locale?: string,
): string {
  const low = oneDecimal(temperatureInUnit(minCelsius, unit), locale);
  const high = oneDecimal(temperatureInUnit(maxCelsius, unit), locale);
  return `${low}–${high} ${TEMPERATURE_SYMBOL[unit]}`;
}

/**
 * Relative humidity is a percentage from 0 to 100 (WMO Guide to Instruments and Methods of
 * Observation, WMO-No. 8, Volume I, chapter 4 — from memory): water vapour pressure as a share
 * of saturation over water at the same temperature. Loggers report it to whole or tenth
 * percents; above 100 % is a sensor fault, not supersaturation worth storing.
 */
export const HUMIDITY_MIN = 0;
export const HUMIDITY_MAX = 100;

export function isRelativeHumidity(percent: number): boolean {
  return Number.isFinite(percent) && percent >= HUMIDITY_MIN && percent <= HUMIDITY_MAX;
}

/** Why a typed humidity cannot be stored, in words, or null when it can. */
export function humidityProblem(percent: number): string | null {
  if (!Number.isFinite(percent)) return 'Give the humidity as a number from 0 to 100.';
  if (!isRelativeHumidity(percent))
    return 'Relative humidity is from 0 to 100 %. Check the reading.';
  return null;
}

/** "72 %", "72.5 %" (a tenth at most), "—" when there is no reading. */
export function formatHumidity(percent: number | null, locale?: string): string {
  if (percent === null) return '—';
  const text = new Intl.NumberFormat(locale, { maximumFractionDigits: 1 }).format(
    roundTo(percent, 1),
  );
  return `${text} %`;
}
