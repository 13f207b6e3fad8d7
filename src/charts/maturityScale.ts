import { scaleLinear, scaleSqrt, type ScaleContinuousNumeric } from 'd3-scale';
import type { MaturityAxis } from '../core/index.ts';

/** The shared maturity axis: linear in years, or square-root spaced so the short end can be read. */
export function maturityScale(axis: MaturityAxis, xMax: number, range: [number, number]): ScaleContinuousNumeric<number, number> {
  return (axis === 'sqrt' ? scaleSqrt() : scaleLinear()).domain([0, xMax]).range(range);
}

const SQRT_TICKS = [0.25, 1, 2, 3, 5, 7, 10, 15, 20, 30, 40, 50];
export function maturityTicks(axis: MaturityAxis, xMax: number): number[] {
  if (axis === 'sqrt') return [0, ...SQRT_TICKS.filter((t) => t <= xMax)];
  const step = xMax > 25 ? 5 : xMax > 10 ? 2 : xMax > 4 ? 1 : 0.5;
  const out: number[] = [];
  for (let t = 0; t <= xMax + 1e-9; t += step) out.push(Math.round(t * 100) / 100);
  return out;
}
