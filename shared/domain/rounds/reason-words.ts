import { daysBetween, type LocalDate } from '../local-dates';

// Small words and date sums the round's reasons are written with.

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
/** "3 Mar" — the short date used in reasons. */
export function shortDate(date: LocalDate): string {
  return `${Number(date.slice(8, 10))} ${MONTHS[Number(date.slice(5, 7)) - 1]}`;
}

export const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;
export const later = (a: LocalDate, b: LocalDate) => (a > b ? a : b);
export const latest = (...dates: (LocalDate | null | undefined)[]): LocalDate | null =>
  dates.reduce<LocalDate | null>((best, d) => (d && (!best || d > best) ? d : best), null);
/** Days a task has waited since it fell due. */
export const carriedFrom = (due: LocalDate, date: LocalDate) => Math.max(0, daysBetween(due, date));
