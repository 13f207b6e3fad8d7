import { useMemo } from 'react';
import {
  addDays,
  addTenor,
  daysBetween,
  forwardOn,
  instantaneousForwardOn,
  parseTenor,
  parYieldOn,
  zeroOn,
  type Curve,
  type Repricing,
} from '../core/index.ts';
import type { DisplaySettings } from '../core/input/index.ts';

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

/** Samples on each chart: fine enough that straight segments between them follow the model. */
export const ZERO_SAMPLES = 360;
export const PAR_SAMPLES = 120;

/** The end of the drawn maturity range: the last pillar, or further when the curve extrapolates. */
export function chartEndDate(curve: Curve): string {
  const last = curve.pillars[curve.pillars.length - 1]?.date ?? curve.settlement;
  if (curve.extrapolation !== 'flat-forward') return last;
  const span = daysBetween(curve.settlement, last);
  return addDays(last, Math.max(365, Math.round(span * 0.12)));
}

/** Evenly spaced sample dates from settlement to `end` (n + 1 of them, distinct). */
export function sampleDates(settlement: string, end: string, n: number): string[] {
  const days = daysBetween(settlement, end);
  const out: string[] = [];
  let prev = -1;
  for (let k = 0; k <= n; k++) {
    const d = Math.round((k * days) / n);
    if (d === prev) continue;
    prev = d;
    out.push(addDays(settlement, d));
  }
  return out;
}

/** Forward of the chosen tenor starting at each sample date, in the display convention. */
export function forwardSeries(curve: Curve, display: DisplaySettings, dates: readonly string[]): SamplePoint[] {
  const tenor = parseTenor(display.forwardTenor)!;
  const out: SamplePoint[] = [];
  for (const d of dates) {
    const f = forwardOn(curve, d, addTenor(d, tenor), display.compounding, display.dayCount);
    if (f.ok) out.push({ date: d, x: curve.time(d), y: f.value.rate, extrapolated: f.value.extrapolated });
  }
  return out;
}

/** Samples every line of both charts from the core's curve. */
export function curveSeries(curve: Curve, display: DisplaySettings, repricing: readonly Repricing[]): CurveSeries {
  const end = chartEndDate(curve);
  const dates = sampleDates(curve.settlement, end, ZERO_SAMPLES);
  const zero: SamplePoint[] = [];
  for (const d of dates) {
    const z = zeroOn(curve, d, display.compounding, display.dayCount);
    if (z.ok) zero.push({ date: d, x: z.value.t, y: z.value.zero, extrapolated: z.value.extrapolated });
  }
  const par: SamplePoint[] = [];
  if (display.showPar) {
    for (const d of sampleDates(curve.settlement, end, PAR_SAMPLES).slice(1)) {
      const p = parYieldOn(curve, d, display.parFrequency);
      if (p.ok) par.push({ date: d, x: curve.time(d), y: p.value.rate, extrapolated: p.value.extrapolated });
    }
  }
  const forward = forwardSeries(curve, display, dates);
  const instantaneous: SamplePoint[] = [];
  if (display.showInstantaneous) {
    for (const d of dates) {
      const f = instantaneousForwardOn(curve, d);
      if (f.ok) instantaneous.push({ date: d, x: f.value.t, y: f.value.forward, extrapolated: f.value.extrapolated });
    }
  }
  const markers = repricing.flatMap((r) => {
    const p = parYieldOn(curve, r.maturity, display.parFrequency);
    return p.ok ? [{ date: r.maturity, x: r.t, y: p.value.rate, extrapolated: false, quote: r.index, kind: r.kind }] : [];
  });
  return {
    zero,
    par,
    forward,
    instantaneous,
    markers,
    pillars: curve.pillars.map((p) => ({ x: p.t, date: p.date })),
    xMax: curve.time(end),
    lastT: curve.lastT,
  };
}

export function useCurveSeries(curve: Curve | null, display: DisplaySettings, repricing: readonly Repricing[]): CurveSeries | null {
  return useMemo(() => (curve ? curveSeries(curve, display, repricing) : null), [curve, display, repricing]);
}
