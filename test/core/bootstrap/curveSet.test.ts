import { describe, expect, it } from 'vitest';
import { bootstrapCurveSet, buildCurve, nodeGroups, type CurveRoles, type Instrument } from '../../../src/core/index.ts';
import { bootstrapInstruments } from '../../../src/core/bootstrap/bootstrap.ts';
import { INVENTED_2027, INVENTED_2027_EVERY_KIND, workspaceDoc } from '../../helpers/markets.ts';

// Curves by role: the build's set of named curves and the node groups its bootstrap is shaped by.
// The reference is the engine's own single-curve bootstrap (bootstrapInstruments), which the
// golden check holds bit for bit; the markets are invented test data (test/helpers/markets.ts).

/** The same instrument reading other curves (its prototype keeps every method and figure). */
const reading = (ins: Instrument, curves: CurveRoles): Instrument => Object.create(ins, { curves: { value: curves } }) as Instrument;

const settingsOf = (build: ReturnType<typeof buildCurve>) => ({
  settlement: build.workspace!.settlement,
  dayCount: build.workspace!.curve.dayCount,
  interpolation: build.workspace!.curve.interpolation,
  extrapolation: build.workspace!.curve.extrapolation,
});

describe('curves by role', () => {
  it('buildCurve gives one curve, named discount, which is build.curve', () => {
    const build = buildCurve(workspaceDoc(INVENTED_2027_EVERY_KIND));
    expect(build.curve).not.toBeNull();
    expect(Object.keys(build.curves)).toEqual(['discount']);
    expect(build.curves.discount).toBe(build.curve);
  });

  it('buildCurve without a curve gives no curves', () => {
    const build = buildCurve(workspaceDoc([{ ...INVENTED_2027.depo1M, rate: 'x' }]));
    expect(build.curve).toBeNull();
    expect(build.curves).toEqual({});
  });

  it('every kind declares the curves it reads: a swap projects on the one curve, the others only discount', () => {
    const build = buildCurve(workspaceDoc(INVENTED_2027_EVERY_KIND));
    for (const ins of build.instruments) {
      expect(ins.curves.discount).toBe('discount');
      expect(ins.curves.projection).toBe(ins.kind === 'swap' ? 'discount' : undefined);
    }
  });

  it('nodeGroups keeps one market in one group, the very array given', () => {
    const { instruments } = buildCurve(workspaceDoc(INVENTED_2027_EVERY_KIND));
    const groups = nodeGroups(instruments);
    expect(groups).toHaveLength(1);
    expect(groups[0]!.curve).toBe('discount');
    expect(groups[0]!.instruments).toBe(instruments);
  });

  it('bootstrapCurveSet with one group equals bootstrapInstruments bit for bit', () => {
    const build = buildCurve(workspaceDoc(INVENTED_2027_EVERY_KIND));
    const alone = bootstrapInstruments(settingsOf(build), build.instruments);
    const set = bootstrapCurveSet(settingsOf(build), build.instruments);
    expect(set.repricing).toEqual(alone.repricing);
    for (const t of [0.1, 1, 2.5, 7, 20]) expect(set.curves.discount!.lnDiscountAt(t)).toBe(alone.curve!.lnDiscountAt(t));
  });

  it('instruments whose nodes lie on two curves reading only their own are solved as two curves', () => {
    const build = buildCurve(workspaceDoc([INVENTED_2027.depo1M, INVENTED_2027.depo3M, INVENTED_2027.swap2Y, INVENTED_2027.swap5Y, INVENTED_2027.swap10Y]));
    const settings = settingsOf(build);
    const own = (ins: Instrument): Instrument => (ins.kind === 'swap' ? reading(ins, { discount: 'swaps', projection: 'swaps' }) : ins);
    const moved = build.instruments.map(own);
    const groups = nodeGroups(moved);
    expect(groups.map((g) => [g.curve, g.instruments.length])).toEqual([
      ['discount', 2],
      ['swaps', 3],
    ]);
    const set = bootstrapCurveSet(settings, moved);
    expect(set.errors).toEqual([]);
    expect(Object.keys(set.curves).sort()).toEqual(['discount', 'swaps']);
    const swapsAlone = bootstrapInstruments(settings, groups[1]!.instruments);
    expect(set.curves.swaps!.lnDiscountAt(4)).toBe(swapsAlone.curve!.lnDiscountAt(4));
    expect(set.repricing).toHaveLength(5);
  });

  it('an instrument reading a curve other than its node\'s is refused with its quote named (no joint solve yet)', () => {
    const build = buildCurve(workspaceDoc([INVENTED_2027.depo1M, INVENTED_2027.swap2Y]));
    const moved = build.instruments.map((ins) => (ins.kind === 'swap' ? reading(ins, { discount: 'discount', projection: 'term-index' }) : ins));
    const set = bootstrapCurveSet(settingsOf(build), moved);
    expect(set.curve).toBeNull();
    expect(set.curves).toEqual({});
    expect(set.errors).toHaveLength(1);
    expect(set.errors[0]!.quote).toBe(1);
    expect(set.errors[0]!.message).toMatch(/quotes\[1\] \(swap .*\) reads the curve "term-index"/);
  });
});
