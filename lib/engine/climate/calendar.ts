/** Calendar arithmetic of a typical year, keyed by month/day/hour only (never by a year). */

const DAYS_COMMON = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
const DAYS_LEAP = [31, 29, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

const MONTH_NAMES = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

/** Days in a month (1…12) of a common or a leap year; 0 for a month that does not exist. */
export function daysInMonth(month: number, leap: boolean): number {
  return (leap ? DAYS_LEAP : DAYS_COMMON)[month - 1] ?? 0;
}

/** Whether month/day exists in a year that may include 29 February. */
export function isValidMonthDay(month: number, day: number): boolean {
  return Number.isInteger(month) && Number.isInteger(day) && day >= 1 && day <= daysInMonth(month, true);
}

/** First hour-of-year index of each month (13 entries, the last one = hours in the year). */
export function monthStartHours(leap: boolean): number[] {
  const days = leap ? DAYS_LEAP : DAYS_COMMON;
  const starts = [0];
  let h = 0;
  for (const d of days) {
    h += d * 24;
    starts.push(h);
  }
  return starts;
}

/** Hour-of-year index 0… of (month 1…12, day 1…, hour 0…23). */
export function hourOfYear(month: number, day: number, hour: number, starts: number[]): number {
  return (starts[month - 1] ?? 0) + (day - 1) * 24 + hour;
}

/** Month/day/hour arrays of a whole year in calendar order. */
export function calendarOfYear(leap: boolean): { month: number[]; day: number[]; hour: number[] } {
  const month: number[] = [];
  const day: number[] = [];
  const hour: number[] = [];
  for (let m = 1; m <= 12; m++) {
    const nd = daysInMonth(m, leap);
    for (let d = 1; d <= nd; d++) {
      for (let h = 0; h < 24; h++) {
        month.push(m);
        day.push(d);
        hour.push(h);
      }
    }
  }
  return { month, day, hour };
}

/** "3 Mar 14:00" for messages. */
export function describeHour(month: number, day: number, hour: number): string {
  return `${day} ${MONTH_NAMES[month - 1] ?? `month ${month}`} ${String(hour).padStart(2, "0")}:00`;
}
