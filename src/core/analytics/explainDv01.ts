import type { BootstrapSettings } from '../bootstrap/bootstrap.ts';
import type { Curve } from '../curve/curve.ts';
import { explainedConventions, LN_UNIT, type ExplainedStep, type Explanation } from '../curve/explain.ts';
import type { Instrument } from '../instruments/instrument.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import type { Flow } from './keyRates.ts';
import { quoteDv01Of, type QuoteDv01Record } from './quoteDv01.ts';
import { quoteYieldOf } from './quoteYield.ts';

const PER100 = 'per 100 face';

/**
 * Explains the DV01 of a bond's flows to the quote at position `k` of `instruments` (the DV01 to
 * each quote table), by quoteDv01Of itself run with a record: the quote's own yield y0, each side
 * moved to y0 +- 1 bp and requoted in the quote's unit, the curve rebuilt with `settings` (ln DF
 * at each flow time t, years on the curve's day count), the dirty price P = sum CF_i exp(ln DF(t_i))
 * per 100 face, and DV01 = (P(-) - P(+)) / 2 per 100 face per bp, the table's figure bit for bit.
 * `curve` is the shown curve (its conventions are stated).
 */
export function explainQuoteDv01(curve: Curve, settings: BootstrapSettings, instruments: readonly Instrument[], flows: readonly Flow[], k: number): Result<Explanation> {
  const ins = instruments[k];
  if (!ins) return fail(coreError('schema', 'quote', 'this quote is not in the curve now'));
  const qy = quoteYieldOf(ins, settings.settlement);
  const rec: QuoteDv01Record = { yield: NaN, sides: [] };
  const d = quoteDv01Of(settings, instruments, flows, k, qy, rec);
  if (!d.ok) return d;
  const label = qy.label;
  const steps: ExplainedStep[] = [{ name: 'y0', formula: `y0 = the quote's own yield, ${label}, at its market value ${ins.market}`, inputs: [], value: rec.yield, unit: `decimal per year, ${label}` }];
  flows.forEach((f, i) => steps.push({ name: `CF${i + 1}`, formula: `CF${i + 1} = the bond's flow at t${i + 1} = ${f.t} years (${curve.dayCount})`, inputs: [], value: f.amount, unit: PER100 }));
  for (const side of rec.sides) {
    const s = side.dy > 0 ? '+' : '-';
    steps.push({ name: `q${s}`, formula: `q${s} = the quote at y0 ${s} 1 bp, in its own unit (${ins.unit})`, inputs: ['y0'], value: side.market, unit: ins.unit === 'price' ? 'per 100 (price)' : `decimal per year, ${label}` });
    side.ln.forEach((l, i) => steps.push({ name: `ln DF${s}(t${i + 1})`, formula: `ln DF${s}(t${i + 1}) on the curve rebuilt with q${s} (${curve.interpolation}, every other quote as it is)`, inputs: [`q${s}`], value: l, unit: LN_UNIT }));
    const terms = flows.map((_, i) => `CF${i + 1} exp(ln DF${s}(t${i + 1}))`);
    steps.push({ name: `P${s}`, formula: `P${s} = ${terms.length <= 3 ? terms.join(' + ') : `${terms[0]} + ... + ${terms.at(-1)}`}`, inputs: flows.flatMap((_, i) => [`CF${i + 1}`, `ln DF${s}(t${i + 1})`]), value: side.price, unit: PER100 });
  }
  steps.push({ name: 'DV01', formula: 'DV01 = (P- - P+) / 2', inputs: ['P-', 'P+'], value: d.value, unit: `${PER100} per bp` });
  return ok({
    quantity: 'bond-figure',
    formula: `DV01 to a quote = (P(y0 - 1 bp) - P(y0 + 1 bp)) / 2: y0 the quote's ${label}, P the bond's dirty price sum CF_i DF(t_i) on the curve rebuilt with the quote moved (per 100 face per bp; positive when a rise in the quote lowers the price)`,
    value: d.value,
    unit: `${PER100} per bp`,
    conventions: explainedConventions(curve, null, null),
    dates: [],
    yearFractions: [],
    reads: [],
    steps,
  });
}
