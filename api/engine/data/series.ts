/** A stock's annual data: catches and survey indices, as the engine reads them. */

export interface SurveyIndex {
  name: string;
  /** One value a year (null where the survey did not run). */
  values: (number | null)[];
  /** Optional coefficient of variation per year (null where not given). */
  cv: (number | null)[] | null;
}

export interface StockSeries {
  years: number[];
  /** Removals per year; null where not recorded (filled by interpolation for fitting). */
  catches: (number | null)[];
  /** Predator removals per year, for linked predator-prey stocks (then `catches` is the prey's). */
  predatorCatches?: (number | null)[];
  indices: SurveyIndex[];
  /** Spawners and the recruits they produced, per spawning year, for stock-recruitment files. */
  stockRecruit?: { spawners: (number | null)[]; recruits: (number | null)[] };
}

/** Catches with gaps filled by linear interpolation (nearest value at the ends), and the years filled. */
export function filledCatches(series: StockSeries, which: 'catches' | 'predatorCatches' = 'catches'): { catches: number[]; filledYears: number[] } {
  const values = series[which] ?? series.years.map(() => 0);
  const known = values.map((c, i) => (c === null ? null : i)).filter((i): i is number => i !== null);
  if (known.length === 0) throw new Error('no catch is recorded in any year');
  const filledYears: number[] = [];
  const catches = values.map((c, i) => {
    if (c !== null) return c;
    filledYears.push(series.years[i]!);
    const before = known.filter((k) => k < i).pop();
    const after = known.find((k) => k > i);
    if (before === undefined) return values[after!]!;
    if (after === undefined) return values[before]!;
    const w = (i - before) / (after - before);
    return (1 - w) * values[before]! + w * values[after]!;
  });
  return { catches, filledYears };
}
