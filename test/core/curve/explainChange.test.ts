// A scenario change explained: its two parts are the untraced zero / forward queries on the base
// and scenario curves, and its last step is the Scenarios table's figure, all bit for bit.
import fixtureJson from '../../fixtures/share/workspace40.json';
import {
  applyScenario,
  buildCurve,
  COMPARISON_TENORS,
  explainScenarioChange,
  forwardOn,
  marketDate,
  parseTenor,
  scenarioEffects,
  zeroOn,
  type Curve,
  type EffectConventions,
  type Scenario,
} from '../../../src/core/index.ts';

const build = buildCurve(fixtureJson as unknown as Record<string, unknown>);
const base = build.curve!;
const ws = build.workspace!;

const SCENARIOS: Scenario[] = [
  { id: 'p', name: 'Up 25', space: 'zero', shape: { kind: 'parallel', bp: 25 } },
  { id: 't', name: 'Flattener', space: 'quotes', shape: { kind: 'twist', short: '2Y', pivot: '5Y', long: '10Y', bp: -20 } },
  { id: 'b', name: 'Butterfly', space: 'zero', shape: { kind: 'butterfly', short: '2Y', belly: '5Y', long: '10Y', wingsBp: -5, bellyBp: 15 } },
];
const CONVENTIONS: EffectConventions[] = [
  { zeroCompounding: 'continuous', zeroDayCount: 'ACT/365F', forwardTenor: '3M', forwardCompounding: 'simple', forwardDayCount: 'ACT/360' },
  { zeroCompounding: 'semiannual', zeroDayCount: '30/360', forwardTenor: '6M', forwardCompounding: 'annual', forwardDayCount: 'ACT/365F' },
];

const moved = (s: Scenario): Curve => {
  const r = applyScenario(s, ws, base);
  if (!r.ok) throw new Error(r.errors[0]!.message);
  return r.value.curve;
};

describe('explainScenarioChange', () => {
  it('ends in the table figure and its parts are the untraced queries, bit for bit', () => {
    let checked = 0;
    for (const s of SCENARIOS) {
      const scenario = moved(s);
      for (const conv of CONVENTIONS) {
        const rows = scenarioEffects(base, scenario, COMPARISON_TENORS, conv);
        for (const row of rows) {
          const date = marketDate(base.settlement, parseTenor(row.tenor)!);
          const end = marketDate(date, parseTenor(conv.forwardTenor)!);
          for (const field of ['zero', 'forward'] as const) {
            const figure = field === 'zero' ? row.zeroBp : row.forwardBp;
            const r = explainScenarioChange(base, scenario, row.tenor, field, conv);
            if (figure === null) {
              expect(r.ok).toBe(false);
              continue;
            }
            if (!r.ok) throw new Error(r.errors[0]!.message);
            const { explanation: e, base: b, scenario: sc } = r.value;
            const where = `${s.name}, ${row.tenor} ${field}, ${conv.zeroCompounding}`;
            // The table's figure: scenarioEffects, what ScenarioTable shows.
            expect(Object.is(e.steps.at(-1)!.value, figure), where).toBe(true);
            expect(Object.is(e.value, figure), where).toBe(true);
            // The parts: the untraced queries on the two curves (query.ts, no sink).
            const untraced = (c: Curve): number => {
              const q = field === 'zero' ? zeroOn(c, date, conv.zeroCompounding, conv.zeroDayCount) : forwardOn(c, date, end, conv.forwardCompounding, conv.forwardDayCount);
              if (!q.ok) throw new Error(q.errors[0]!.message);
              return 'zero' in q.value ? q.value.zero : q.value.rate;
            };
            expect(Object.is(b.value, untraced(base)), `${where}: base`).toBe(true);
            expect(Object.is(sc.value, untraced(scenario)), `${where}: scenario`).toBe(true);
            expect(b.quantity).toBe(field === 'zero' ? 'zero-rate' : 'forward-rate');
            // The last step recomputed from the parts shown: 1 bp = 0.0001 (definition of a basis point).
            expect(e.steps.at(-1)!.value).toBe((sc.value - b.value) * 1e4);
            expect(e.steps.at(-1)!.inputs).toEqual(['scenario rate', 'base rate']);
            // Every step of each part is there, under its curve's name.
            expect(e.steps.length).toBe(b.steps.length + sc.steps.length + 1);
            expect(e.reads.map((x) => x.name)).toEqual([...b.reads.map((x) => `base ${x.name}`), ...sc.reads.map((x) => `scenario ${x.name}`)]);
            checked++;
          }
        }
      }
    }
    expect(checked).toBeGreaterThan(80);
  });

  it('says which tenor is wrong instead of explaining nothing', () => {
    const r = explainScenarioChange(base, moved(SCENARIOS[0]!), 'soon', 'zero', CONVENTIONS[0]!);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0]!.message).toBe('"soon" is not a tenor');
  });
});
