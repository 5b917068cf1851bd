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
  indices: SurveyIndex[];
}

/** Catches with gaps filled by linear interpolation (nearest value at the ends), and the years filled. */
export function filledCatches(series: StockSeries): { catches: number[]; filledYears: number[] } {
  const known = series.catches.map((c, i) => (c === null ? null : i)).filter((i): i is number => i !== null);
  if (known.length === 0) throw new Error('no catch is recorded in any year');
  const filledYears: number[] = [];
  const catches = series.catches.map((c, i) => {
    if (c !== null) return c;
    filledYears.push(series.years[i]!);
    const before = known.filter((k) => k < i).pop();
    const after = known.find((k) => k > i);
    if (before === undefined) return series.catches[after!]!;
    if (after === undefined) return series.catches[before]!;
    const w = (i - before) / (after - before);
    return (1 - w) * series.catches[before]! + w * series.catches[after]!;
  });
  return { catches, filledYears };
}
