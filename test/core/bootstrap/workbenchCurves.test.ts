import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  buildCurve,
  buildNamedCurves,
  buildWorkbenchCurves,
  curveSpreadAt,
  parseTenor,
  queryYearFraction,
  readNamedCurves,
  workbenchFromEngine,
  zeroOn,
  forwardOn,
  namedQuoteValueField,
  setNamedQuoteValue,
  type Curve,
} from '../../../src/core/index.ts';

// The workbench's named curves (issue 18 item 10): a workspace file with `curves`, opened in the
// workbench, builds each named curve exactly as the `curve` command does (the engine's own
// buildCurve with readNamedCurves, then buildNamedCurves: test/core/bootstrap/namedCurves.test.ts
// holds those to a hand calculation of the two-curve par rate), and the spread between two curves
// is the difference of the core's zero rates (or forwards) at each date. The fixture is the
// command line's invented test document (test/fixtures/namedCurves/SOURCE.md).

const FIXTURE = JSON.parse(readFileSync('test/fixtures/namedCurves/two-curves.json', 'utf8')) as Record<string, unknown> & { curves: Record<string, unknown>[] };
const fromFile = () => {
  let n = 0;
  const wb = workbenchFromEngine(FIXTURE, () => `r${n++}`, readNamedCurves);
  if (!wb.ok) throw new Error(wb.errors[0]!.message);
  return wb.value;
};
/** The command line's builds of the fixture (src/cli/curveCommand.ts builds them this way). */
const cli = () => {
  const main = buildCurve(FIXTURE, { readCurves: readNamedCurves, skipInvalid: true });
  return { main, named: buildNamedCurves(main.workspace!, main.curve, { skipInvalid: true }) };
};

describe('buildWorkbenchCurves', () => {
  it('builds the named curves of an opened file as the curve command does, to the bit', () => {
    const wb = fromFile();
    expect(wb.curves).toEqual(FIXTURE.curves); // kept as the file gives them
    const { main, named } = cli();
    const built = buildWorkbenchCurves(wb, main.curve);
    expect(built.errors).toEqual([]);
    expect(built.curves.map((c) => c.name)).toEqual(['euribor6m', 'govt']);
    for (const c of built.curves) {
      const ref = named.find((x) => x.name === c.name)!;
      expect(c.build.curve!.pillars.map((p) => p.discount)).toEqual(ref.build.curve!.pillars.map((p) => p.discount));
      expect(c.build.repricing.map((r) => r.repricingError)).toEqual(ref.build.repricing.map((r) => r.repricingError));
    }
    // The projection curve's swaps were discounted on the default curve, its deposit on none.
    const p = built.curves[0]!;
    expect(p.role).toBe('projection');
    expect(p.discountCurve).toBe('default');
  });

  it('names what to change for a name used twice, a projection curve without a discounting curve and a circle, building none and changing nothing', () => {
    const twice = { ...FIXTURE, curves: [FIXTURE.curves[0]!, { ...FIXTURE.curves[1]!, name: 'euribor6m' }] };
    const noDiscount = { ...FIXTURE, curves: [{ ...FIXTURE.curves[0]!, discountCurve: undefined }] };
    const circle = {
      ...FIXTURE,
      curves: [
        { ...FIXTURE.curves[0]!, name: 'a', discountCurve: 'b' },
        { ...FIXTURE.curves[0]!, name: 'b', discountCurve: 'a' },
      ],
    };
    const cases: [typeof FIXTURE, RegExp][] = [
      [twice, /curves\[1\]\.name: the curve name "euribor6m" is used twice \(curves\[0\] and curves\[1\]\); rename one/],
      [noDiscount, /"euribor6m": a projection curve needs a discounting curve: set discountCurve to "default"/],
      [circle, /the curves "a" -> "b" -> "a" each need the next built first .* in a circle/],
    ];
    const { main } = cli();
    for (const [doc, message] of cases) {
      const inputs = { settlement: '2027-03-10', curves: JSON.parse(JSON.stringify(doc.curves)) as unknown[] };
      const before = JSON.stringify(inputs);
      const r = buildWorkbenchCurves(inputs, main.curve);
      expect(r.curves).toEqual([]);
      expect(r.errors.map((e) => e.message).join('\n')).toMatch(message);
      expect(JSON.stringify(inputs)).toBe(before);
    }
  });

  it('a workspace without named curves builds none and reads nothing', () => {
    expect(buildWorkbenchCurves({ settlement: '2027-03-10' }, null)).toEqual({ curves: [], errors: [] });
  });
});

describe('curveSpreadAt', () => {
  const { main, named } = cli();
  const a = named.find((c) => c.name === 'euribor6m')!.build.curve!;
  const b = main.curve!;
  const DATES = ['2027-09-10', '2028-03-10', '2029-03-12', '2032-03-10', '2037-03-10'];

  it('is the difference of the two curves\' zero rates computed by the core at named dates, in bp, to 1e-12', () => {
    const points = curveSpreadAt(a, b, 'zero', DATES, 'annual', 'ACT/360', parseTenor('3M')!);
    expect(points.map((p) => p.date)).toEqual(DATES);
    for (const p of points) {
      const za = zeroOn(a, p.date, 'annual', 'ACT/360');
      const zb = zeroOn(b, p.date, 'annual', 'ACT/360');
      if (!za.ok || !zb.ok) throw new Error('in range');
      expect(Math.abs(p.bp - (za.value.zero - zb.value.zero) * 1e4)).toBeLessThanOrEqual(1e-12);
      // And from the discount factors by the textbook definition z = DF^(-1/tau) - 1 (annual, tau on ACT/360).
      const tau = queryYearFraction('ACT/360', '2027-03-10', p.date);
      const z = (c: Curve) => Math.exp(-c.lnDiscountAt(c.time(p.date)) / tau) - 1;
      expect(Math.abs(p.bp - (z(a) - z(b)) * 1e4)).toBeLessThanOrEqual(1e-9);
    }
    // Not zero: the two curves differ (the check can tell a spread from nothing).
    expect(Math.abs(points[3]!.bp)).toBeGreaterThan(1);
  });

  it('of forwards is the difference of the core\'s forwards over [T, T + tenor], and a curve minus itself is zero', () => {
    // The last date's forward ends past euribor6m's last pillar (10Y, no extrapolation): left out.
    const points = curveSpreadAt(a, b, 'forward', DATES, 'continuous', 'ACT/365F', parseTenor('6M')!);
    expect(points.map((p) => p.date)).toEqual(DATES.slice(0, 4));
    for (const p of points) {
      const end = p.date.replace(/^(\d{4})-(\d{2})/, (_, y: string, m: string) => (Number(m) + 6 > 12 ? `${Number(y) + 1}-${String(Number(m) - 6).padStart(2, '0')}` : `${y}-${String(Number(m) + 6).padStart(2, '0')}`));
      const fa = forwardOn(a, p.date, end, 'continuous', 'ACT/365F');
      const fb = forwardOn(b, p.date, end, 'continuous', 'ACT/365F');
      if (!fa.ok || !fb.ok) throw new Error('in range');
      expect(Math.abs(p.bp - (fa.value.rate - fb.value.rate) * 1e4)).toBeLessThanOrEqual(1e-12);
    }
    for (const p of curveSpreadAt(a, a, 'zero', DATES, 'annual', 'ACT/360', parseTenor('3M')!)) expect(p.bp).toBe(0);
  });

  it('leaves out dates a curve does not reach', () => {
    const govt = named.find((c) => c.name === 'govt')!.build.curve!; // last pillar 5Y, no extrapolation
    const points = curveSpreadAt(govt, b, 'zero', DATES, 'annual', 'ACT/360', parseTenor('3M')!);
    expect(points.map((p) => p.date)).toEqual(DATES.slice(0, 4));
  });
});

describe('setNamedQuoteValue', () => {
  it('sets one quote\'s value field to the double nearest the typed decimal, every other entry the very same object', () => {
    const curves = FIXTURE.curves as readonly unknown[];
    const out = setNamedQuoteValue(curves, 'euribor6m', 1, ' 0.0271 ') as { quotes: Record<string, unknown>[] }[];
    expect(out[0]!.quotes[1]).toEqual({ kind: 'swap', tenor: '2Y', rate: 0.0271 });
    expect(out[0]!.quotes[0]).toBe((curves[0] as { quotes: unknown[] }).quotes[0]);
    expect(out[1]).toBe(curves[1]);
    expect((curves[0] as { quotes: Record<string, unknown>[] }).quotes[1]!.rate).toBe(0.0263); // the input is not changed
    // 0.1 + 0.2 typed as 0.3 is the double 0.3 (the nearest), not a sum.
    expect((setNamedQuoteValue(curves, 'govt', 0, '0.3') as { quotes: Record<string, unknown>[] }[])[1]!.quotes[0]!.rate).toBe(0.3);
    // Text that is no number is kept as typed; an unknown curve or quote changes nothing.
    expect((setNamedQuoteValue(curves, 'govt', 0, '2%x') as { quotes: Record<string, unknown>[] }[])[1]!.quotes[0]!.rate).toBe('2%x');
    expect(setNamedQuoteValue(curves, 'nope', 0, '1')).toBe(curves);
    expect(setNamedQuoteValue(curves, 'govt', 9, '1')).toBe(curves);
    expect(namedQuoteValueField({ kind: 'bond', cleanPrice: 99 })).toBe('cleanPrice');
    expect(namedQuoteValueField('x')).toBeNull();
  });
});
