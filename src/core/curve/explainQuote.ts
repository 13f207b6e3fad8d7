import type { Curve } from './curve.ts';
import { explainedConventions, explainedYearFraction, explainRead, rateSteps, type ExplainedDate, type ExplainedRead, type ExplainedStep, type ExplainedYearFraction, type Explanation } from './explain.ts';
import { quoteConventionTag } from '../format/conventionTag.ts';
import { quoteSchedule } from '../input/quoteSchedule.ts';
import { convexityFillText } from '../input/quoteSchedule.ts';
import { quoteOnCurve, type Instrument } from '../instruments/instrument.ts';
import { modelConvexityBp } from '../instruments/convexity.ts';
import { FUTURE_BASIS } from '../instruments/future.ts';
import { quoteConvention } from '../kinds/registry.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import { serialFromIso, type IsoDate } from '../time/date.ts';
import type { DayCount } from '../time/dayCount.ts';

/**
 * Explanations of the quote check: a quote's model value re-priced off the built curve, and its
 * difference from the market. The model value is the instrument's own `quoteFromFlows` run through
 * `quoteOnCurve` (the same call the quote check's repricing makes, which reads the flow table the
 * bootstrap left; a property test holds the two equal bit for bit) with a {@link QuoteTrace}: the
 * instrument hands its own intermediate values (the annuity, the growth, the dirty price, the
 * forward rate), and the steps below are built from them. The reads are the ln DF the call read at
 * each flow time, each explained by explainRead (node or interpolated, between which nodes).
 */

/** Which figure of the quote check: the model value ('Implied by curve') or model minus market ('Repricing error'). */
export type QuoteCheckFigure = 'model' | 'error';

const PRICE_UNIT = 'per 100 face';
const BP_UNIT = 'bp (1 bp = 0.0001 of the rate)';

/** The quote's fields that hold dates, and its schedule's, by which a flow's time is named. */
function candidateDates(q: Instrument['quote'], settlement: IsoDate, curve: Curve): IsoDate[] {
  const out: IsoDate[] = [settlement];
  const rec = q as unknown as Record<string, unknown>;
  for (const k of ['start', 'end', 'maturity', 'settle', 'spot']) if (typeof rec[k] === 'string' && /^\d{4}-\d\d-\d\d$/.test(rec[k])) out.push(rec[k]);
  for (const r of quoteSchedule(q, settlement, curve)?.rows ?? []) {
    for (const d of [r.start, r.end, r.accrualEnd, r.fixingDate]) if (d !== undefined) out.push(d);
  }
  return out;
}

/** The names of an instrument's flow times in its formula (E, S, T1..Tn, b1..bn). */
function flowLabels(ins: Instrument): string[] {
  const n = ins.times.length;
  const kind = ins.kind;
  if (kind === 'deposit' || kind === 'fra') return n === 1 ? ['E'] : ['S', 'E'];
  if (kind === 'zero' || kind === 'bill') return n === 1 ? ['M'] : ['S', 'M'];
  if (kind === 'future') {
    if (n === 2) return [(ins as unknown as { lnKnown: number }).lnKnown === 0 ? 'S' : 'c', 'E'];
    if (n === 3 && (ins as unknown as { w?: number }).w !== undefined) return ['b0', 'b1', 'E'];
    return Array.from({ length: n }, (_, j) => (j === n - 1 ? 'b_next' : `b${j + 1}`));
  }
  if (kind === 'bond' && n > 1 && ins.amounts[0] === 0) return ['settle', ...Array.from({ length: n - 1 }, (_, j) => `T${j + 1}`)];
  return Array.from({ length: n }, (_, j) => `T${j + 1}`);
}

/** a + b + ... written short for long sums. */
const sum = (terms: readonly string[]): string => (terms.length <= 4 ? terms.join(' + ') : `${terms[0]} + ${terms[1]} + ... + ${terms[terms.length - 1]}`);

/**
 * Explains the model value of `ins` re-priced on `curve` (the quote check's 'Implied by curve'), or
 * with `figure` 'error' its difference from the market in the table's unit (bp for a rate, per 100
 * for a price). `settlement`: the valuation date of the build; `lnAt` the ln DF read (the curve's by
 * default; a fit's residuals read its form, fit/explainFit.ts). An error value for a kind whose
 * arithmetic is not traced (the panel then says so) or a curve that gives no number.
 */
export function explainQuoteCheck(curve: Curve, ins: Instrument, settlement: IsoDate, figure: QuoteCheckFigure = 'model', lnAt: (t: number) => number = curve.lnDiscountAt): Result<Explanation> {
  const q = ins.quote;
  const lns: number[] = [];
  const trace: { name: string; value: number }[] = [];
  const model = quoteOnCurve(
    ins,
    (t) => {
      const y = lnAt(t);
      lns.push(y);
      return y;
    },
    (name, value) => trace.push({ name, value }),
  );
  if (trace.length === 0) return fail(coreError('schema', `quotes[${ins.index}]`, `the quote check's ${q.kind} quotes do not explain their arithmetic yet (deposits, FRAs, swaps, OIS, bonds, futures, bills and zeros do)`));
  if (!Number.isFinite(model)) return fail(coreError('schema', `quotes[${ins.index}]`, `the curve gives no model value for the ${q.kind} ${ins.maturity}`));
  const labels = flowLabels(ins);
  const cands = candidateDates(q, settlement, curve);
  const dateAt = (t: number): IsoDate | undefined => cands.find((d) => curve.time(d) === t);
  const dates: ExplainedDate[] = [];
  const reads: ExplainedRead[] = ins.times.map((t, j) => {
    const d = dateAt(t) ?? settlement;
    dates.push({ name: labels[j]!, given: d, unadjusted: d, adjusted: d, rule: 'as the quote check schedules it' });
    return explainRead(curve, `DF(${labels[j]})`, d, t, lns[j]!);
  });
  const conv = quoteConvention(q);
  const tag = quoteConventionTag(conv);
  const unit = ins.unit === 'price' ? PRICE_UNIT : `decimal per year, ${tag}`;
  const steps: ExplainedStep[] = [];
  const yfs: ExplainedYearFraction[] = [];
  const step = (name: string, formula: string, inputs: string[], value: number, u = 'unitless'): void => {
    // A read's ln DF is shown with its DF, under the read's name.
    steps.push({ name, formula: `${name} = ${formula}`, inputs: inputs.map((i) => i.replace(/^ln DF\(/, 'DF(')), value, unit: u });
  };
  const got = (name: string, k = 0): number => trace.filter((x) => x.name === name)[k]!.value;
  const ln = (j: number): string => `ln DF(${labels[j]})`;
  const field = ins.field;
  let formula: string;
  const rec = ins as unknown as Record<string, unknown>;
  if (q.kind === 'deposit' || q.kind === 'fra') {
    const tau = rec.tau as number;
    const end = q.kind === 'fra' ? q.end : q.maturity;
    yfs.push(explainedYearFraction('tau', q.dayCount, q.start, end, tau));
    const spot = labels.length === 1;
    formula = `${field} = (DF(S) / DF(E) - 1) / tau, simple on ${q.dayCount}${spot ? ', S the settlement (DF(S) = 1)' : ''}`;
    step('g', spot ? 'DF(S) / DF(E) - 1 = expm1(-ln DF(E))' : 'DF(S) / DF(E) - 1 = expm1(ln DF(S) - ln DF(E))', spot ? [ln(0)] : [ln(0), ln(1)], got('g'));
    step('model', 'g / tau', ['g', 'tau'], model, unit);
  } else if (q.kind === 'zero' || q.kind === 'bill') {
    const spot = labels.length === 2;
    const from = spot ? (q.settle ?? settlement) : settlement;
    const lnP = got('lnP');
    step('lnP', spot ? 'ln DF(M) - ln DF(S): the flow of 100 at M seen from the settle date S' : 'ln DF(M)', spot ? [ln(0), ln(1)] : [ln(0)], lnP, 'natural log of a discount factor');
    if (ins.unit === 'price') {
      formula = `price = 100 x ${spot ? 'DF(M) / DF(S)' : 'DF(M)'}, per 100 face`;
      step('model', '100 x exp(lnP)', ['lnP'], model, unit);
    } else if (q.kind === 'bill') {
      const days = rec.days as number;
      formula = `discount yield = (1 - P) x 360 / days, P = ${spot ? 'DF(M) / DF(S)' : 'DF(M)'} (bank discount, ACT/360)`;
      steps.push({ name: 'days', formula: `days = actual days from ${from} to ${q.maturity}`, inputs: [], value: days, unit: 'days' });
      step('d', '1 - P = -expm1(lnP)', ['lnP'], -Math.expm1(lnP));
      step('model', 'd x 360 / days', ['d', 'days'], model, unit);
    } else {
      const tau = rec.tau as number;
      yfs.push(explainedYearFraction('tau', q.dayCount, from, q.maturity, tau));
      formula = `zero rate from P = ${spot ? 'DF(M) / DF(S)' : 'DF(M)'} over tau, ${tag}`;
      const rs = rateSteps(lnP, q.compounding, tau, model, unit);
      steps.push(...rs.slice(0, -1), { ...rs.at(-1)!, name: 'model', formula: rs.at(-1)!.formula.replace(/^rate =/, 'model =') });
    }
  } else if (q.kind === 'swap' || q.kind === 'ois') {
    const taus = rec.taus as readonly number[];
    const rows = quoteSchedule(q, settlement, curve)?.rows ?? [];
    taus.forEach((tau, i) => {
      const r = rows[i];
      yfs.push(explainedYearFraction(`tau${i + 1}`, q.dayCount, r?.start ?? settlement, r?.accrualEnd ?? r?.end ?? settlement, tau));
    });
    const lagged = trace.some((x) => x.name === 'float');
    if (!lagged) {
      const n = taus.length;
      formula = `${field} = (1 - DF(T${n})) / A, A = sum tau_i DF(T_i) over the fixed leg's ${n} period${n === 1 ? '' : 's'} (single-curve par swap: the floating leg is worth 1 - DF(T${n}))`;
      step('A', sum(taus.map((_, i) => `tau${i + 1} x DF(T${i + 1})`)), taus.flatMap((_, i) => [`tau${i + 1}`, `DF(T${i + 1})`]), got('A'));
      step('num', `1 - DF(T${n}) = -expm1(ln DF(T${n}))`, [`ln DF(T${n})`], got('num'));
      step('model', 'num / A', ['num', 'A'], model, unit);
    } else {
      const { sIdx, eIdx, pIdx } = rec as { sIdx: number[]; eIdx: number[]; pIdx: number[] };
      const nm = (j: number): string => (j < 0 ? 'DF(settlement)' : `DF(${labels[j]})`);
      formula = `${field} = floating leg / A: floating leg = sum_i (DF(S_i) / DF(E_i) - 1) DF(P_i), A = sum_i tau_i DF(P_i) (accrual start S_i, end E_i, payment P_i; DF(settlement) = 1): the overnight rate compounded over each period telescopes on one curve`;
      const terms = taus.map((_, i) => `(${nm(sIdx[i]!)} / ${nm(eIdx[i]!)} - 1) x ${nm(pIdx[i]!)}`);
      step('A', sum(taus.map((_, i) => `tau${i + 1} x ${nm(pIdx[i]!)}`)), taus.flatMap((_, i) => [`tau${i + 1}`, nm(pIdx[i]!)]), got('A'));
      step('float', sum(terms), taus.flatMap((_, i) => [nm(sIdx[i]!), nm(eIdx[i]!), nm(pIdx[i]!)]), got('float'));
      step('model', 'float / A', ['float', 'A'], model, unit);
    }
  } else if (q.kind === 'bond') {
    const spot = labels[0] === 'settle';
    const idx = ins.amounts.length;
    const flows = Array.from({ length: idx }, (_, j) => j).filter((j) => !spot || j > 0);
    for (const j of flows) step(`CF${j + (spot ? 0 : 1)}`, `the bond's flow at ${labels[j]} per 100 face (coupon 100 c / f, plus 100 at maturity)`, [], ins.amounts[j]!, PRICE_UNIT);
    const cf = flows.map((j) => `CF${j + (spot ? 0 : 1)} x DF(${labels[j]})`);
    const pairs = flows.flatMap((j) => [`CF${j + (spot ? 0 : 1)}`, `DF(${labels[j]})`]);
    if (spot) {
      step('pv', sum(cf), pairs, got('pv'), PRICE_UNIT);
      step('dirty', 'pv / DF(settle)', ['pv', 'DF(settle)'], got('dirty'), PRICE_UNIT);
    } else step('dirty', sum(cf), pairs, got('dirty'), PRICE_UNIT);
    const accrued = rec.accrued as number;
    step('accrued', `100 c x the accrual fraction from the last coupon date to ${spot ? 'the settle date' : 'settlement'} (${q.dayCount})`, [], accrued, PRICE_UNIT);
    if (ins.unit === 'price') {
      formula = `clean price = sum CF_i DF(T_i)${spot ? ' / DF(settle)' : ''} - accrued interest, per 100 face`;
      step('model', 'dirty - accrued', ['dirty', 'accrued'], model, unit);
    } else {
      formula = `yield = the ICMA yield y (compounded ${q.frequency} times a year) at which the bond's flows discount to the model dirty price sum CF_i DF(T_i)${spot ? ' / DF(settle)' : ''}`;
      step('model', `the y with sum_i CF_i / (1 + y / ${q.frequency})^(f x t_i) = dirty, t_i in coupon periods from ${spot ? 'the settle date' : 'settlement'} (ICMA; solved by safeguarded Newton)`, ['dirty'], model, unit);
    }
  } else if (q.kind === 'future') {
    const ca = q.convexity;
    const caWords = q.convexityFill
      ? `CA = ${convexityFillText(q.convexityFill)}: the model's adjustment at the futures rate (100 - price) / 100 over the period's ${dayDiff(q.start, q.end)} days`
      : ca === 0 ? 'CA = 0: no convexity adjustment' : 'CA = as typed on the quote';
    const caValue = q.convexityFill ? modelConvexityBp(q.convexityFill, (100 - q.price) / 100, dayDiff(q.start, q.end), q.convexityFill.t1, q.convexityFill.t2) : ca;
    steps.push({ name: 'CA', formula: caWords, inputs: [], value: caValue, unit: 'bp on the futures rate (simple, ACT/360)' });
    if (q.contract === '3M') {
      const tau = rec.tau as number;
      yfs.push(explainedYearFraction('tau', 'ACT/360', q.start, q.end, tau));
      const holiday = labels[0] === 'b0';
      if (holiday) {
        const w = rec.w as number;
        formula = 'price = 100 x (1 - (R + CA / 10,000)), R = (DF(S) / DF(E) - 1) / tau, the period starting on a holiday S whose first days carry the rate of the business day b0 before it: DF(S) = w DF(b0) + (1 - w) DF(b1)';
        steps.push({ name: 'w', formula: `w = (b1 - S) / (b1 - b0), days`, inputs: [], value: w, unit: 'unitless' });
        step('lnStart', 'ln(1 + w x expm1(ln DF(b0) - ln DF(b1))) + ln DF(b1)', ['w', ln(0), ln(1)], got('lnStart'), 'natural log of a discount factor');
        step('g', 'expm1(lnStart - ln DF(E))', ['lnStart', ln(2)], got('g'));
      } else {
        const known = rec.lnKnown as number;
        formula = `price = 100 x (1 - (R + CA / 10,000)), R = (DF(S) / DF(E) - 1) / tau: the overnight rate compounded over the quarter, simple on ACT/360 (one curve: the daily factors telescope)`;
        if (known !== 0) {
          steps.push({ name: 'ln known', formula: 'ln known = ln of the growth already fixed from S to c (the fixings given, compounded daily)', inputs: [], value: known, unit: 'natural log of a growth factor' });
          step('g', 'expm1(ln known + ln DF(c) - ln DF(E))', ['ln known', ln(0), ln(1)], got('g'));
        } else step('g', 'expm1(ln DF(S) - ln DF(E))', [ln(0), ln(1)], got('g'));
      }
      step('R', 'g / tau', ['g', 'tau'], got('R'), 'decimal per year, simple, ACT/360');
    } else {
      const { weights, spans, days, knownSum } = rec as { weights: number[]; spans: number[]; days: number; knownSum: number };
      formula = `price = 100 x (1 - (R + CA / 10,000)), R = (1 / N) x (known + sum_i w_i r_i): the month's N = ${days} calendar days averaged, business day b_i's overnight rate r_i = (DF(b_i) / DF(b_i+1) - 1) x 360 / n_i carried by w_i days`;
      if (knownSum !== 0) steps.push({ name: 'known', formula: 'known = sum of w_i x the fixing given, over the days before the valuation date', inputs: [], value: knownSum, unit: 'decimal per year x days' });
      weights.forEach((w, i) => {
        steps.push({ name: `n${i + 1}`, formula: `n${i + 1} = calendar days from b${i + 1} to the next business day`, inputs: [], value: spans[i]!, unit: 'days' });
        steps.push({ name: `w${i + 1}`, formula: `w${i + 1} = calendar days of the month carrying b${i + 1}'s rate`, inputs: [], value: w, unit: 'days' });
        step(`r${i + 1}`, `expm1(${ln(i)} - ${ln(i + 1)}) x ${FUTURE_BASIS} / n${i + 1}`, [ln(i), ln(i + 1), `n${i + 1}`], got('r', i), 'decimal per year, simple, ACT/360');
      });
      step('sum', `${knownSum !== 0 ? 'known + ' : ''}${sum(weights.map((_, i) => `w${i + 1} x r${i + 1}`))}`, [...(knownSum !== 0 ? ['known'] : []), ...weights.flatMap((_, i) => [`w${i + 1}`, `r${i + 1}`])], got('sum'), 'decimal per year x days');
      step('R', `sum / ${days}`, ['sum'], got('R'), 'decimal per year, simple, ACT/360');
    }
    step('model', '100 x (1 - (R + CA / 10,000))', ['R', 'CA'], model, unit);
  } else {
    return fail(coreError('schema', `quotes[${ins.index}]`, `the quote check's ${q.kind} quotes do not explain their arithmetic yet`));
  }
  let value = model;
  if (figure === 'error') {
    formula = `difference = ${ins.unit === 'price' ? 'model - market, per 100 face' : '(model - market) x 10,000, in bp'}; model: ${formula}`;
    const diff = ins.unit === 'price' ? model - ins.market : (model - ins.market) * 1e4;
    steps.push({ name: 'market', formula: `market = the ${field} as quoted on the sheet`, inputs: [], value: ins.market, unit });
    steps.push({ name: 'difference', formula: ins.unit === 'price' ? 'difference = model - market' : 'difference = (model - market) x 10,000', inputs: ['model', 'market'], value: diff, unit: ins.unit === 'price' ? PRICE_UNIT : BP_UNIT });
    value = diff;
  }
  return ok({
    quantity: figure === 'model' ? 'quote-model' : 'quote-error',
    formula,
    value,
    unit: figure === 'error' ? (ins.unit === 'price' ? PRICE_UNIT : BP_UNIT) : unit,
    conventions: {
      ...explainedConventions(curve, conv.unit === 'rate' && conv.compounding !== 'bank-discount' && conv.compounding !== 'bill-equivalent' ? conv.compounding : null, conv.unit === 'rate' ? conv.dayCount : 'dayCount' in q ? (q as { dayCount: DayCount }).dayCount : null),
      businessDay: (rec.quote as { businessDay?: string }).businessDay ?? 'unadjusted',
      calendar: (rec.quote as { calendar?: string | null }).calendar ?? 'none',
    },
    dates,
    yearFractions: yfs,
    reads,
    steps,
  });
}

/** Calendar days between two ISO dates. */
const dayDiff = (a: IsoDate, b: IsoDate): number => serialFromIso(b) - serialFromIso(a);
