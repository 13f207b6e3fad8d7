import { useMemo } from 'react';
import { addDays, daysBetween, parseTenor, type Curve, type Repricing } from '../core/index.ts';
import {
  forwardSamples,
  instantaneousSamples,
  lnOnGrid,
  parBondsGrid,
  parGrid,
  parSamples,
  sampleGrid,
  zeroSamples,
  type DisplaySettings,
  type ParGrid,
  type SampleGrid,
  type Samples,
} from '../core/index.ts';

/** One sample of a curve for a chart: x in years on the curve's axis, y a decimal rate. */
export interface SamplePoint {
  readonly date: string;
  readonly x: number;
  readonly y: number;
  readonly extrapolated: boolean;
}

export interface CurveSeries {
  readonly zero: readonly SamplePoint[];
  readonly par: readonly SamplePoint[];
  readonly forward: readonly SamplePoint[];
  readonly instantaneous: readonly SamplePoint[];
  /** Quotes as markers on the par-yield line at their maturities. */
  readonly markers: readonly (SamplePoint & { readonly quote: number; readonly kind: string })[];
  readonly pillars: readonly { readonly x: number; readonly date: string }[];
  readonly xMax: number;
  readonly lastT: number;
}

/** Samples on each chart: fine enough that straight segments between them follow the model (par yields: every month, see parGrid). */
export const ZERO_SAMPLES = 400;

/** The end of the drawn maturity range: the last pillar, or further when the curve extrapolates. */
export function chartEndDate(curve: Curve): string {
  const last = curve.pillars[curve.pillars.length - 1]?.date ?? curve.settlement;
  if (curve.extrapolation !== 'flat-forward') return last;
  const span = daysBetween(curve.settlement, last);
  return addDays(last, Math.max(365, Math.round(span * 0.12)));
}

/** Grids depend on dates and conventions only, not on the quotes: kept across edits. */
const grids = new Map<string, SampleGrid | ParGrid>();
function cached<T extends SampleGrid | ParGrid>(key: string, make: () => T): T {
  let g = grids.get(key) as T | undefined;
  if (!g) {
    if (grids.size > 24) grids.clear();
    g = make();
    grids.set(key, g);
  }
  return g;
}

export function sampleGridFor(curve: Curve, display: DisplaySettings): SampleGrid {
  const end = chartEndDate(curve);
  return cached(`z|${curve.settlement}|${end}|${curve.dayCount}|${display.dayCount}|${display.forwardTenor}`, () =>
    sampleGrid(curve.settlement, end, ZERO_SAMPLES, curve.dayCount, display.dayCount, parseTenor(display.forwardTenor)!),
  );
}

export const points = (s: Samples): SamplePoint[] => s.dates.map((date, i) => ({ date, x: s.x[i]!, y: s.y[i]!, extrapolated: s.extrapolated[i]! }));

/** Forwards of the chosen tenor starting at each sample date, in the display convention. */
export const forwardSeries = (curve: Curve, display: DisplaySettings): SamplePoint[] => points(forwardSamples(curve, sampleGridFor(curve, display), display.compounding));

/** Samples every line of both charts from the core's curve. */
export function curveSeries(curve: Curve, display: DisplaySettings, repricing: readonly Repricing[]): CurveSeries {
  const end = chartEndDate(curve);
  const grid = sampleGridFor(curve, display);
  let par: SamplePoint[] = [];
  let markers: CurveSeries['markers'] = [];
  if (display.showPar) {
    const pg = cached(`p|${curve.settlement}|${end}|${curve.dayCount}|${display.parFrequency}`, () => parGrid(curve.settlement, end, curve.dayCount, display.parFrequency));
    par = points(parSamples(curve, pg));
    // Marker grid: one par bond per quote maturity (cached by the set of maturities).
    const mats = repricing.map((r) => r.maturity);
    const key = `m|${curve.settlement}|${curve.dayCount}|${display.parFrequency}|${mats.join(',')}`;
    const mg = cached(key, () => parBondsGrid(curve.settlement, mats, curve.dayCount, display.parFrequency));
    const ms = parSamples(curve, mg);
    const byDate = new Map(ms.dates.map((d, i) => [d, ms.y[i]!]));
    markers = repricing.flatMap((r) => {
      const y = byDate.get(r.maturity);
      return y === undefined ? [] : [{ date: r.maturity, x: r.t, y, extrapolated: false, quote: r.index, kind: r.kind }];
    });
  }
  const ln = lnOnGrid(curve, grid); // read by both lines
  return {
    zero: points(zeroSamples(curve, grid, display.compounding, ln)),
    par,
    forward: points(forwardSamples(curve, grid, display.compounding, ln)),
    instantaneous: display.showInstantaneous ? points(instantaneousSamples(curve, grid)) : [],
    markers,
    pillars: curve.pillars.map((p) => ({ x: p.t, date: p.date })),
    xMax: curve.time(end),
    lastT: curve.lastT,
  };
}

/** The last base series and what it was sampled from (the build's and the store's objects, by identity). */
let lastSeries: { readonly curve: Curve; readonly display: DisplaySettings; readonly repricing: readonly Repricing[]; readonly series: CurveSeries } | null = null;

/**
 * curveSeries of the base curve, or the last result when the curve, display settings and repricing
 * are the very same objects: the start-up samples the charts in a task before the first render
 * (src/hooks/firstFrame.ts), and the charts' first render reads it.
 */
export function baseCurveSeries(curve: Curve, display: DisplaySettings, repricing: readonly Repricing[]): CurveSeries {
  if (lastSeries && lastSeries.curve === curve && lastSeries.display === display && lastSeries.repricing === repricing) return lastSeries.series;
  let series = curveSeries(curve, display, repricing);
  // A value edit keeps every pillar's date and time: the last pillar list is kept too (the same
  // object), so the charts' pillar ticks are not rendered again (RateChart's PillarTicks).
  const kept = lastSeries?.series.pillars;
  if (kept && samePillars(kept, series.pillars)) series = { ...series, pillars: kept };
  lastSeries = { curve, display, repricing, series };
  return series;
}

const samePillars = (a: CurveSeries['pillars'], b: CurveSeries['pillars']): boolean => a.length === b.length && a.every((p, i) => p.x === b[i]!.x && p.date === b[i]!.date);

export function useCurveSeries(curve: Curve | null, display: DisplaySettings, repricing: readonly Repricing[]): CurveSeries | null {
  return useMemo(() => (curve ? baseCurveSeries(curve, display, repricing) : null), [curve, display, repricing]);
}
