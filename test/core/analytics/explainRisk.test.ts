import { describe, expect, it } from 'vitest';
import {
  bootstrapInstruments,
  bumpedForwardSensitivities,
  buildCurve,
  compileMarket,
  curveTime,
  forwardOn,
  forwardParRateOn,
  INTERPOLATIONS,
  parYieldOn,
  quoteYieldOf,
  requoteAtYield,
  topParQuoteInfluences,
  topQuoteInfluences,
  validateWorkspace,
  valueUnderEachMethod,
  yearFraction,
  zeroOn,
  type InterpolationId,
} from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';
import { INVENTED_2027_EVERY_KIND, workspaceDoc } from '../../helpers/markets.ts';

// The quotes behind a number and the number under each method (issue 19). Markets are invented
// (demo data, test/helpers/markets.ts). Sources beside each check.

const doc = workspaceDoc(INVENTED_2027_EVERY_KIND, { interpolation: 'log-linear-discount' });
const ws = validateWorkspace(doc).workspace!;
const instruments = compileMarket(ws.settlement, ws.curve.dayCount, ws.quotes, false).instruments;
const settingsFor = (interpolation: InterpolationId) => ({ settlement: ws.settlement, dayCount: ws.curve.dayCount, interpolation, extrapolation: 'none' as const });

describe('topQuoteInfluences', () => {
  for (const interpolation of ['log-linear-discount', 'linear-zero', 'cubic-zero'] as const) {
    it(`${interpolation}: the top five quotes of a 1Y forward 3Y out are the largest of central-bump rebuilds, with the same values to 1e-6 bp per bp`, () => {
      const curve = bootstrapInstruments(settingsFor(interpolation), instruments).curve!;
      const start = '2030-03-10';
      const end = '2031-03-10';
      const top = topQuoteInfluences(curve, instruments, start, end, 'simple', 'ACT/360');
      if (!top.ok) throw new Error(top.errors[0]!.message);
      expect(top.value).toHaveLength(5);
      // Reference: brute force, each quote moved +-1 bp and +-0.5 bp through its own yield and the curve rebuilt (Richardson).
      const row = { start, end, tStart: curve.time(start), tEnd: curve.time(end), tau: yearFraction('ACT/360', start, end), rate: 0, extrapolated: false };
      const b1 = bumpedForwardSensitivities(settingsFor(interpolation), instruments, [row], 'simple', 1);
      const bh = bumpedForwardSensitivities(settingsFor(interpolation), instruments, [row], 'simple', 0.5);
      if (!b1.ok || !bh.ok) throw new Error('bumped rebuild failed');
      const rich = Array.from(b1.value, (v, k) => ({ index: instruments[k]!.index, value: (4 * bh.value[k]! - v) / 3 }));
      rich.sort((a, b) => Math.abs(b.value) - Math.abs(a.value));
      expect(top.value.map((q) => q.index)).toEqual(rich.slice(0, 5).map((q) => q.index));
      top.value.forEach((q, k) => expectClose(q.bpPerBp, rich[k]!.value, 1e-6, 'central bumped rebuilds, Richardson-combined'));
    });
  }

  it('the zero rate to the first deposit maturity, simple on the deposit day count, moves one for one with that deposit alone', () => {
    // Definition of a deposit: its rate is the simple zero rate on its day count to its maturity,
    // so dz/dr = 1 and no other quote enters (invented two-deposit market).
    const small = buildCurve(
      workspaceDoc([
        { kind: 'deposit', tenor: '3M', rate: 0.0287, dayCount: 'ACT/360' },
        { kind: 'deposit', tenor: '6M', rate: 0.0295, dayCount: 'ACT/360' },
      ]),
    );
    const curve = small.curve!;
    const end = curve.pillars[0]!.date;
    const top = topQuoteInfluences(curve, small.instruments, curve.settlement, end, 'simple', 'ACT/360');
    if (!top.ok) throw new Error(top.errors[0]!.message);
    expectClose(top.value[0]!.bpPerBp, 1, 1e-9, 'definition of a deposit rate');
    expect(top.value[0]!.index).toBe(0);
    expectClose(top.value[1]!.bpPerBp, 0, 1e-12, 'the 6M deposit does not enter the 3M zero');
  });

  it('the zero rate at settlement itself depends on no period: an empty list', () => {
    const curve = bootstrapInstruments(settingsFor('linear-zero'), instruments).curve!;
    const top = topQuoteInfluences(curve, instruments, ws.settlement, ws.settlement, 'continuous', 'ACT/365F');
    expect(top).toEqual({ ok: true, value: [] });
  });
});

describe('topParQuoteInfluences', () => {
  /** Brute force: each quote moved +-h through its own yield, the curve rebuilt, the number read again; central difference. */
  const bumped = (interpolation: InterpolationId, read: (c: ReturnType<typeof bootstrapInstruments>['curve']) => number, bp: number): number[] =>
    instruments.map((ins, k) => {
      const qy = quoteYieldOf(ins, ws.settlement);
      const at = (dy: number) => {
        const moved = instruments.map((other, i) => (i === k ? requoteAtYield(other, qy, qy.toYield(other.market) + dy) : other));
        return read(bootstrapInstruments(settingsFor(interpolation), moved).curve);
      };
      return (at(bp * 1e-4) - at(-bp * 1e-4)) / (2 * bp * 1e-4);
    });
  const cases = [
    { name: 'a 7Y par yield, semi-annual ACT/ACT-ICMA (parYieldOn)', start: null, end: '2034-03-10', frequency: 2, dc: 'ACT/ACT-ICMA' as const },
    { name: 'a 2Y into 5Y forward par swap rate, annual 30/360 (forwardParRateOn)', start: '2029-03-10', end: '2034-03-10', frequency: 1, dc: '30/360' as const },
  ];
  // The methods of the forward check above: smooth in the nodes here (monotone convex's limiter has kinks a 1 bp bump crosses, for forwards alike).
  for (const interpolation of ['log-linear-discount', 'linear-zero', 'cubic-zero'] as const) {
    for (const k of cases) {
      it(`${interpolation}: ${k.name}: the top five are the largest of central-bump rebuilds, the same values to 1e-6 bp per bp`, () => {
        const curve = bootstrapInstruments(settingsFor(interpolation), instruments).curve!;
        const start = k.start ?? curve.settlement;
        const top = topParQuoteInfluences(curve, instruments, start, k.end, k.frequency, k.dc);
        if (!top.ok) throw new Error(top.errors[0]!.message);
        expect(top.value).toHaveLength(5);
        // Reference: the par rate read by the query itself on each rebuilt curve, bumps of 1 and 0.5 bp Richardson-combined.
        const read = (c: ReturnType<typeof bootstrapInstruments>['curve']): number => {
          const r = k.start === null ? parYieldOn(c!, k.end, k.frequency) : forwardParRateOn(c!, start, k.end, k.frequency, k.dc);
          if (!r.ok) throw new Error('par on a rebuilt curve');
          return r.value.rate;
        };
        const b1 = bumped(interpolation, read, 1);
        const bh = bumped(interpolation, read, 0.5);
        const rich = b1.map((v, i) => ({ index: instruments[i]!.index, value: (4 * bh[i]! - v) / 3 }));
        rich.sort((a, b) => Math.abs(b.value) - Math.abs(a.value));
        expect(top.value.map((q) => q.index)).toEqual(rich.slice(0, 5).map((q) => q.index));
        top.value.forEach((q, i) => expectClose(q.bpPerBp, rich[i]!.value, 1e-6, 'central bumped rebuilds, Richardson-combined'));
      });
    }
  }
});

describe('valueUnderEachMethod', () => {
  it('lists every method once, the current one equal bit for bit to the build it was read on', () => {
    for (const method of INTERPOLATIONS) {
      const curve = bootstrapInstruments(settingsFor(method), instruments).curve!;
      const own = forwardOn(curve, '2029-03-10', '2030-03-10', 'annual', 'ACT/365F');
      if (!own.ok) throw new Error('own');
      const all = valueUnderEachMethod(method, (m) => bootstrapInstruments(settingsFor(m), instruments), (c) => {
        const f = forwardOn(c, '2029-03-10', '2030-03-10', 'annual', 'ACT/365F');
        return f.ok ? { ok: true, value: f.value.rate } : f;
      });
      expect(all.map((m) => m.method)).toEqual([...INTERPOLATIONS]);
      expect(all.filter((m) => m.current).map((m) => m.method)).toEqual([method]);
      expect(Object.is(all.find((m) => m.current)!.value, own.value.rate)).toBe(true);
    }
  });

  it('a zero rate at the first deposit maturity is the deposit rate under every method (a single-flow first node does not depend on the method)', () => {
    const small = workspaceDoc([
      { kind: 'deposit', tenor: '3M', rate: 0.0287, dayCount: 'ACT/360' },
      { kind: 'deposit', tenor: '6M', rate: 0.0295, dayCount: 'ACT/360' },
      { kind: 'swap', tenor: '5Y', rate: 0.031, frequency: 1, dayCount: '30/360' },
    ]);
    const b = buildCurve(small);
    const curve = b.curve!;
    const date = curve.pillars[0]!.date;
    const settings = { settlement: curve.settlement, dayCount: curve.dayCount, interpolation: curve.interpolation, extrapolation: curve.extrapolation };
    const all = valueUnderEachMethod(curve.interpolation, (m) => bootstrapInstruments({ ...settings, interpolation: m }, b.instruments), (c) => {
      const z = zeroOn(c, date, 'simple', 'ACT/360');
      return z.ok ? { ok: true, value: z.value.zero } : z;
    });
    for (const m of all) expectClose(m.value!, 0.0287, 1e-14, `${m.method}: definition of a deposit rate`);
    // And a value between nodes does depend on the method: the five are not all equal 4 years out.
    const mid = valueUnderEachMethod(curve.interpolation, (m) => bootstrapInstruments({ ...settings, interpolation: m }, b.instruments), (c) => {
      const z = zeroOn(c, '2030-01-01', 'continuous', 'ACT/365F');
      return z.ok ? { ok: true, value: z.value.zero } : z;
    });
    expect(new Set(mid.map((m) => m.value)).size).toBeGreaterThan(1);
    expect(curveTime('ACT/365F', curve.settlement, '2030-01-01')).toBeGreaterThan(2);
  });
});
