import { dayOfWeek, type LocalDate } from '../local-dates';

/**
 * The temperatures a keeper will ship live invertebrates in. Common practice, no published
 * source: many shippers hold parcels when nights fall below about 5 °C or days exceed about
 * 30 °C. The keeper sets their own range; carriers' and countries' rules come first.
 */
export interface SafeRange {
  minC: number;
  maxC: number;
}
export const DEFAULT_SAFE_RANGE: SafeRange = { minC: 5, maxC: 30 };

/** The forecast for the route, typed in by the keeper: the lowest and highest along the way. */
export interface RouteForecast {
  lowC: number;
  highC: number;
}

export type ShippingConcern =
  | { kind: 'too_cold'; lowC: number; minC: number }
  | { kind: 'too_hot'; highC: number; maxC: number }
  /**
   * Common practice, no published source: ship early in the week, so a parcel delayed by a day
   * is not left in a depot over the weekend.
   */
  | { kind: 'weekend_risk'; weekday: number };

/** ISO weekday (1 Monday … 7 Sunday) from which a one-day delay can reach the weekend. */
const LATE_IN_WEEK = 4;

/**
 * What stands against shipping on `date` with this forecast: nothing means a safe day. The
 * range's ends are safe (5 °C and 30 °C themselves are within a 5–30 °C range).
 */
export function shippingConcerns(
  date: LocalDate,
  forecast: RouteForecast,
  range: SafeRange = DEFAULT_SAFE_RANGE,
): ShippingConcern[] {
  const concerns: ShippingConcern[] = [];
  if (forecast.lowC < range.minC)
    concerns.push({ kind: 'too_cold', lowC: forecast.lowC, minC: range.minC });
  if (forecast.highC > range.maxC)
    concerns.push({ kind: 'too_hot', highC: forecast.highC, maxC: range.maxC });
  const weekday = dayOfWeek(date);
  if (weekday >= LATE_IN_WEEK) concerns.push({ kind: 'weekend_risk', weekday });
  return concerns;
}
