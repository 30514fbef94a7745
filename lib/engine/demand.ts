/**
 * Monthly peak demand from climate records that carry no month (a bin table without months).
 *
 * Bins tell how many hours the plant spends at each demand, not in which month. Two bounds follow:
 *  - upper: every month sees the year's highest demand (the annual peak charged twelve times);
 *  - lower: a perfectly seasonal year, where the months take consecutive twelfths of the demand-duration
 *    curve, so the month ranked k peaks at the demand exceeded for (k − 1)/12 of the year's hours.
 * A real month holds both a seasonal level and day-to-day swings, so its peak lies between them. The
 * estimate is their midpoint for each rank, P̂_k = ½·(P_max + P((k − 1)·H/12)), and — since the ranks
 * cannot be placed on the calendar — every month is charged the mean of the twelve, P̂ = (1/12)·Σ P̂_k.
 * [practice: a stated screening assumption; bins with months, or hourly data, give each month its own
 * peak.] On the repository's hourly fixture binned without months this lands within about −11 … +25 %
 * of the hourly monthly-peak sum (the annual peak twelve times was +14 … +60 %).
 */

/** The demand-duration value: demand (kW) exceeded for `hoursFromTop` of the records' hours. */
function demandAtHoursFromTop(sortedDesc: readonly { kW: number; hours: number }[], hoursFromTop: number): number {
  let cumulative = 0;
  for (const r of sortedDesc) {
    cumulative += r.hours;
    if (cumulative > hoursFromTop) return r.kW;
  }
  return sortedDesc[sortedDesc.length - 1]?.kW ?? 0;
}

/**
 * Estimated peak demand of each month from records without a month, kW (see module comment):
 * P̂ = (1/12)·Σ_{k=1..12} ½·(P_max + P((k − 1)·H/12)), H = the records' hours. 0 without records.
 */
export function monthlyPeakFromMonthlessRecordsKW(records: readonly { kW: number; hours: number }[]): number {
  const rs = records.filter((r) => r.hours > 0 && Number.isFinite(r.kW));
  if (rs.length === 0) return 0;
  const sorted = [...rs].sort((a, b) => b.kW - a.kW);
  const total = sorted.reduce((s, r) => s + r.hours, 0);
  const peak = sorted[0]?.kW ?? 0;
  let sum = 0;
  for (let k = 1; k <= 12; k++) sum += 0.5 * (peak + demandAtHoursFromTop(sorted, ((k - 1) * total) / 12));
  return sum / 12;
}
