// Data for the browser harness pages: the committed 40-quote fixture (invented market) built by the core.
import fixture from '../../fixtures/share/workspace40.json';
import { buildCurve, type Curve } from '../../../src/core/index.ts';

export const FIXTURE = fixture as unknown as Record<string, unknown>;

/** A note of the longest allowed length (2,000 characters), invented text. */
export const LONGEST_NOTE = (() => {
  const sentence = 'Committee pack: the curve was rebuilt after the afternoon re-marks; check the 20Y to 30Y swaps against the broker sheet before circulating. ';
  let s = '';
  while (s.length < 2000) s += sentence;
  return s.slice(0, 2000);
})();

export function baseCurve(doc: Record<string, unknown>): Curve {
  const b = buildCurve(doc, { skipInvalid: true });
  if (!b.curve) throw new Error(b.errors.map((e) => e.message).join('; '));
  return b.curve;
}

/** Samples for a chart: continuous zero (-ln DF / t) and instantaneous forward on the curve's own axis. */
export function samples(curve: Curve, xMax: number, kind: 'zero' | 'forward'): { x: number; y: number }[] {
  const out: { x: number; y: number }[] = [];
  for (let i = 1; i <= 200; i++) {
    const t = (xMax * i) / 200;
    out.push({ x: t, y: kind === 'zero' ? -curve.lnDiscountAt(t) / t : curve.forwardAt(t) });
  }
  return out;
}
