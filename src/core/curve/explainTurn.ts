import type { CurveBuild } from '../bootstrap/build.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import { dayBefore } from '../time/overnightDays.ts';
import { explainedConventions, type ExplainedStep, type Explanation } from './explain.ts';
import { quoteConventionTag } from '../format/conventionTag.ts';
import { quoteConvention } from '../kinds/registry.ts';

/**
 * The explanation of a turn's spread solved from a quote (the Overnight curve section's turns table,
 * `turnSpreads`): the record turnSolve.ts keeps of its own search (TurnSpan.solve), so nothing is
 * solved again. The spread s is the root of g(s) = the spanning quote's model value on the curve
 * bootstrapped from the other quotes with the turn at s, minus its market value; each spread tried
 * is an input with its g (no formula gives g: each is a whole bootstrap), then g on the final curve
 * and the table's figure, s x 10,000 bp, bit for bit. An error value when the turn was not solved.
 */
export function explainSolvedTurn(build: Pick<CurveBuild, 'curve' | 'overnight' | 'instruments'>, index: number): Result<Explanation> {
  const span = build.overnight?.turns.find((t) => t.index === index);
  const rec = span?.solve;
  const ins = rec && build.instruments.find((x) => x.index === rec.quote);
  if (!build.curve || !span || !rec || !ins) return fail(coreError('schema', `turns[${index}]`, 'this turn has no spread solved from a quote on the curve now'));
  const gu = ins.unit === 'price' ? 'per 100 (price)' : `decimal per year, ${quoteConventionTag(quoteConvention(ins.quote))}`;
  const su = 'decimal (bp / 10,000), simple ACT/360 on the overnight rate';
  const steps: ExplainedStep[] = [{ name: 'market', formula: `market = quotes[${ins.index}] (${ins.kind} ${ins.maturity}) as quoted`, inputs: [], value: ins.market, unit: gu }];
  rec.trials.forEach(({ spread, gap }, k) => {
    steps.push({ name: `s${k}`, formula: k === 0 ? `s0 = the spread the search starts from` : `s${k} = the solver's next spread (secant step inside the bracket, bootstrap/solve.ts)`, inputs: [], value: spread, unit: su });
    steps.push({ name: `g${k}`, formula: `g${k} = model - market, the quote priced on the curve bootstrapped from the other quotes with the turn at s${k}`, inputs: [`s${k}`, 'market'], value: gap, unit: gu });
  });
  steps.push({ name: 's', formula: 's = the spread taken (|g| within the repricing tolerance)', inputs: rec.trials.length > 0 ? [`s${rec.trials.length - 1}`] : [], value: span.spread, unit: su });
  steps.push({ name: 'g', formula: 'g = model - market on the final curve, every turn at its spread', inputs: ['s', 'market'], value: rec.gap, unit: gu });
  const value = span.spread * 1e4;
  const unit = 'bp, simple ACT/360, added to each day’s overnight rate';
  steps.push({ name: 'spread', formula: 'spread = s x 10,000 bp', inputs: ['s'], value, unit });
  const rule = 'none: the calendar days the turn’s overnight periods cover (each period starts on a business day and runs to the next)';
  return ok({
    quantity: 'turn-spread',
    formula: `spread s with g(s) = 0: g(s) = model value of quotes[${ins.index}] (${ins.kind} ${ins.maturity}) on the curve bootstrapped from the other quotes with the turn at s, minus its market value; the turn adds s to the overnight rate (simple, ACT/360) of each of its ${span.days} days, so ln DF falls by s x days / 360 across it`,
    value,
    unit,
    conventions: explainedConventions(build.curve, 'simple', 'ACT/360'),
    dates: [
      { name: 'first day carrying the spread', given: span.start, unadjusted: span.start, adjusted: span.start, rule },
      { name: 'last day carrying the spread', given: dayBefore(span.end), unadjusted: dayBefore(span.end), adjusted: dayBefore(span.end), rule },
    ],
    yearFractions: [],
    reads: [],
    steps,
  });
}
