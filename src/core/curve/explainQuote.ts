import type { Curve } from './curve.ts';
import { explainedConventions, explainedYearFraction, explainRead, rateSteps, type ExplainedDate, type ExplainedRead, type ExplainedStep, type ExplainedYearFraction, type Explanation } from './explain.ts';
import { quoteConventionTag } from '../format/conventionTag.ts';
import { convexityFillText, quoteSchedule } from '../input/quoteSchedule.ts';
import { quoteOnCurve, type Instrument, type ReadSink } from '../instruments/instrument.ts';
import { modelConvexityBp } from '../instruments/convexity.ts';
import { FUTURE_BASIS } from '../instruments/future.ts';
import { quoteConvention } from '../kinds/registry.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import { serialFromIso, type IsoDate } from '../time/date.ts';
import { parYieldSchedule } from '../instruments/parYield.ts';
import type { BillQuote, DatedSwapQuote, DepositQuote, FraQuote, Quote, SwapQuote, ZeroQuote } from '../document/types.ts';
import type { DayCount } from '../time/dayCount.ts';
import { COMPOUNDINGS, type Compounding } from '../rates/compounding.ts';

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
const ACT360 = 'decimal per year, simple, ACT/360';

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

/** The names of an instrument's flow times in its formula (E, S, M, b_i, T_i by default), by kind. */
const two = (one: string, a: string, b: string) => (ins: Instrument): string[] => (ins.times.length === 1 ? [one] : [a, b]);
const numbered = (p: string, n: number): string[] => Array.from({ length: n }, (_, j) => `${p}${j + 1}`);
const LABELS: { readonly [K in Quote['kind']]?: (ins: Instrument) => string[] } = {
  deposit: two('E', 'S', 'E'),
  fra: two('E', 'S', 'E'),
  zero: two('M', 'S', 'M'),
  bill: two('M', 'S', 'M'),
  future: (ins) => {
    const n = ins.times.length;
    const rec = ins as unknown as { lnKnown?: number; w?: number };
    return n === 2 ? [rec.lnKnown === 0 ? 'S' : 'c', 'E'] : n === 3 && rec.w !== undefined ? ['b0', 'b1', 'E'] : numbered('b', n);
  },
  'par-yield': (ins) => ('periods' in ins ? ['M'] : numbered('T', ins.times.length)),
  bond: (ins) => (ins.times.length > 1 && ins.amounts[0] === 0 ? ['settle', ...numbered('T', ins.times.length - 1)] : numbered('T', ins.times.length)),
};
const flowLabels = (ins: Instrument): string[] => (LABELS[ins.quote.kind] ?? ((i: Instrument) => numbered('T', i.times.length)))(ins);

/** a + b + ... written short for long sums. */
const sum = (terms: readonly string[]): string => (terms.length <= 4 ? terms.join(' + ') : `${terms[0]} + ${terms[1]} + ... + ${terms[terms.length - 1]}`);

/**
 * Explains the model value of `ins` re-priced on `curve` (the quote check's 'Implied by curve'), or
 * with `figure` 'error' its difference from the market in the table's unit (bp for a rate, per 100
 * for a price). `settlement`: the valuation date of the build; `lnAt` the ln DF read (the curve's by
 * default; a fit's residuals read its form, fit/explainFit.ts). An error value for a kind whose
 * arithmetic is not traced (the panel then says so) or a curve that gives no number.
 */
export function explainQuoteCheck(curve: Curve, ins: Instrument, settlement: IsoDate, figure: QuoteCheckFigure = 'model', lnAt: (t: number) => number = curve.lnDiscountAt, own = 'this curve'): Result<Explanation> {
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
  if (trace.length === 0) return fail(coreError('schema', `quotes[${ins.index}]`, `${q.kind} quotes do not explain their arithmetic yet`));
  if (!Number.isFinite(model)) return fail(coreError('schema', `quotes[${ins.index}]`, 'no model value on this curve'));
  const labels = flowLabels(ins);
  const cands = candidateDates(q, settlement, curve);
  const dateAt = (t: number): IsoDate | undefined => cands.find((d) => curve.time(d) === t);
  // An instrument holding values of curves built before it (readsCurves): its compile again with a sink, each value it read there.
  const across = ins.readsCurves;
  const far: Parameters<ReadSink>[] = [];
  ins.retrace?.((...r) => far.push(r));
  const P = (c: string, d: string): string => `P_${c}(${d})`;
  const dates: ExplainedDate[] = [];
  const floating = far.filter((r) => r[0] === 'T');
  const reads: ExplainedRead[] = ins.times.map((t, j) => {
    const d = floating[j]?.[3] ?? dateAt(t) ?? settlement;
    dates.push({ name: labels[j]!, given: d, unadjusted: d, adjusted: d, rule: 'as scheduled' });
    return explainRead(curve, across ? P(own, labels[j]!) : `DF(${labels[j]})`, d, t, lns[j]!);
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
  /** A traced sum of products, each term's factors its inputs. */
  const sumStep = (name: string, terms: string[][], u?: string): void => step(name, sum(terms.map((t) => t.join(' x '))), terms.flat(), got(name), u);
  const ln = (j: number): string => `ln DF(${labels[j]})`;
  const field = ins.field;
  let formula: string;
  const rec = ins as unknown as Record<string, unknown>;
  function moneyMarket(q: DepositQuote | FraQuote, end: IsoDate): string {
    const tau = rec.tau as number;
    yfs.push(explainedYearFraction('tau', q.dayCount, q.start, end, tau));
    const spot = labels.length === 1;
    formula = `${field} = (DF(S) / DF(E) - 1) / tau${spot ? ', DF(S) = 1' : ''}`;
    step('g', spot ? 'expm1(-ln DF(E))' : 'expm1(ln DF(S) - ln DF(E))', spot ? [ln(0)] : [ln(0), ln(1)], got('g'));
    step('model', 'g / tau', ['g', 'tau'], model, unit);
    return formula;
  }
  function singleFlow(q: ZeroQuote | BillQuote, bill: boolean): string {
    const spot = labels.length === 2;
    const from = spot ? (q.settle ?? settlement) : settlement;
    const lnP = got('lnP');
    step('lnP', spot ? 'ln DF(M) - ln DF(S)' : 'ln DF(M)', spot ? [ln(0), ln(1)] : [ln(0)], lnP, 'ln');
    if (ins.unit === 'price') {
      formula = 'price = 100 exp(lnP)';
      step('model', '100 x exp(lnP)', ['lnP'], model, unit);
    } else if (bill) {
      const days = rec.days as number;
      formula = 'discount yield = (1 - P) x 360 / days, P = exp(lnP)';
      step('days', `actual days ${from} to ${q.maturity}`, [], days, 'days');
      step('d', '-expm1(lnP)', ['lnP'], -Math.expm1(lnP));
      step('model', 'd x 360 / days', ['d', 'days'], model, unit);
    } else {
      const tau = rec.tau as number;
      const z = q as ZeroQuote;
      yfs.push(explainedYearFraction('tau', z.dayCount, from, q.maturity, tau));
      formula = `zero rate (${tag}) of P = exp(lnP) over tau`;
      const rs = rateSteps(lnP, z.compounding, tau, model, unit);
      steps.push(...rs.slice(0, -1), { ...rs.at(-1)!, name: 'model', formula: rs.at(-1)!.formula.replace(/^rate =/, 'model =') });
    }
    return formula;
  }
  function parSwap(q: SwapQuote | DatedSwapQuote): string {
    const taus = rec.taus as readonly number[];
    const rows = quoteSchedule(q, settlement, curve)?.rows ?? [];
    taus.forEach((tau, i) => {
      const r = rows[i];
      yfs.push(explainedYearFraction(`tau${i + 1}`, q.dayCount, r?.start ?? settlement, r?.accrualEnd ?? r?.end ?? settlement, tau));
    });
    const lagged = trace.some((x) => x.name === 'float');
    if (!lagged) {
      const n = taus.length;
      formula = `${field} = (1 - DF(T${n})) / A, A = sum tau_i DF(T_i) (one curve: the floating leg is worth 1 - DF(T${n}))`;
      sumStep('A', taus.map((_, i) => [`tau${i + 1}`, `DF(T${i + 1})`]));
      step('num', `-expm1(ln DF(T${n}))`, [`ln DF(T${n})`], got('num'));
      step('model', 'num / A', ['num', 'A'], model, unit);
    } else {
      const { sIdx, eIdx, pIdx } = rec as { sIdx: number[]; eIdx: number[]; pIdx: number[] };
      const nm = (j: number): string => (j < 0 ? 'DF(settlement)' : `DF(${labels[j]})`);
      formula = `${field} = float / A, float = sum (DF(S_i) / DF(E_i) - 1) DF(P_i) (overnight compounded over each period, start S_i, end E_i, paid P_i), A = sum tau_i DF(P_i)`;
      const terms = taus.map((_, i) => `(${nm(sIdx[i]!)} / ${nm(eIdx[i]!)} - 1) x ${nm(pIdx[i]!)}`);
      sumStep('A', taus.map((_, i) => [`tau${i + 1}`, nm(pIdx[i]!)]));
      step('float', sum(terms), taus.flatMap((_, i) => [nm(sIdx[i]!), nm(eIdx[i]!), nm(pIdx[i]!)]), got('float'));
      step('model', 'float / A', ['float', 'A'], model, unit);
    }
    return formula;
  }
  function projected(q: SwapQuote, { discount, other }: NonNullable<Instrument['readsCurves']>): string {
    // Each value read off the curves built before it, named by role and position on its curve (U_i fixed or spread dates, T_j floating, V_k the other leg's), each with its date.
    const seen: Record<string, number> = {};
    let prev = settlement;
    for (const [role, c, on, d, t, y, tau] of far) {
      const k = (seen[role + c] = (seen[role + c] ?? 0) + 1);
      if (tau !== undefined) yfs.push(explainedYearFraction(`tau${k}`, q.dayCount, prev, (prev = d), tau));
      const r = explainRead(on, P(c, role + k), d, t, y);
      reads.push({ ...r, curve: c, nodes: r.nodes.map((x) => ({ ...x, curve: c })) });
    }
    const pd = (x: string): string => P(discount, x);
    // A leg: sum_k w_k x P_discount(role k), its value the instrument's own (traced).
    const leg = (name: string, role: string, w: (k: number) => string): void => sumStep(name, Array.from({ length: seen[role + discount]! }, (_, i) => [w(i + 1), pd(role + (i + 1))]));
    const pp = (j: number): string => P(own, `T${j}`);
    labels.forEach((_, i) => step(`g${i + 1}`, `expm1(ln ${pp(i)} - ln ${pp(i + 1)})`, [pp(i), pp(i + 1)], got('g', i)));
    leg('float', 'T', (k) => `g${k}`);
    leg('A', 'U', (k) => `tau${k}`);
    const v = other === null ? 'float / A' : '(C - float) / A';
    if (other !== null) {
      const po = (k: number): string => P(other, `V${k}`);
      leg('C', 'V', (k) => `(${k > 1 ? po(k - 1) : 1} / ${po(k)} - 1)`);
    }
    step('model', v, other === null ? ['float', 'A'] : ['C', 'float', 'A'], model, unit);
    return `${field} = ${v}, float = sum g_j ${pd('T_j')}, g_j = tau_j F_j the ${own} forward of period j, A = sum tau_i ${pd('U_i')}`;
  }
  // Each kind's steps, by kind (a map, as the schedules are: nothing here switches on a kind's name); each returns the definition.
  const KIND_STEPS: { readonly [K in Quote['kind']]?: (q: Extract<Quote, { kind: K }>) => string } = {
    deposit: (q) => moneyMarket(q, q.maturity),
    fra: (q) => moneyMarket(q, q.end),
    zero: (q) => singleFlow(q, false),
    bill: (q) => singleFlow(q, true),
    swap: (q) => (across ? projected(q, across) : parSwap(q)),
    ois: (q) => parSwap(q),
    bond: (q) => {
      const spot = labels[0] === 'settle';
      const idx = ins.amounts.length;
      const flows = Array.from({ length: idx }, (_, j) => j).filter((j) => !spot || j > 0);
      for (const j of flows) step(`CF${j + (spot ? 0 : 1)}`, `flow at ${labels[j]}`, [], ins.amounts[j]!, PRICE_UNIT);
      sumStep(spot ? 'pv' : 'dirty', flows.map((j) => [`CF${j + (spot ? 0 : 1)}`, `DF(${labels[j]})`]), PRICE_UNIT);
      if (spot) step('dirty', 'pv / DF(settle)', ['pv', 'DF(settle)'], got('dirty'), PRICE_UNIT);
      const accrued = rec.accrued as number;
      step('accrued', `100 c x accrual fraction (${q.dayCount})`, [], accrued, PRICE_UNIT);
      if (ins.unit === 'price') {
        formula = `clean price = sum CF_i DF(T_i)${spot ? ' / DF(settle)' : ''} - accrued`;
        step('model', 'dirty - accrued', ['dirty', 'accrued'], model, unit);
      } else {
        formula = `ICMA yield at dirty = sum CF_i DF(T_i)${spot ? ' / DF(settle)' : ''}`;
        step('model', `y: sum CF_i (1 + y/${q.frequency})^-(periods to T_i) = dirty`, ['dirty'], model, unit);
      }
      return formula;
    },
    'par-yield': (q) => {
      // Federal Reserve GSW 2006 par yield; at one year or less a zero's bond-equivalent yield; the US Treasury bill basis (SIA).
      const f = q.frequency;
      if (!('periods' in rec)) {
        const n = ins.times.length;
        const prev = parYieldSchedule(q, settlement).previousIso;
        formula = `par yield = (1 - DF(T${n})) / ((1/${f}) sum DF(T_k) - a), a = accrued fraction of a year (coupon = par yield, clean price 100)`;
        step('a', `year fraction ${prev} to ${settlement} (${q.dayCount})`, [], rec.accrualFraction as number);
        sumStep('sum', labels.map((l) => [`DF(${l})`]));
        step('den', `sum / ${f} - a`, ['sum', 'a'], got('den'));
        step('num', `1 - DF(T${n})`, [`DF(T${n})`], got('num'));
        step('model', 'num / den', ['num', 'den'], model, unit);
        return formula;
      }
      const lnP = got('lnP');
      step('lnP', 'ln DF(M)', [ln(0)], lnP, 'ln');
      const bill = rec.bill as { days: number; basis: number } | null;
      if (!bill) {
        formula = `par yield = ${f} ((DF(M))^(-1/n) - 1), n coupon periods to maturity (a zero's bond-equivalent yield)`;
        step('n', `coupon periods ${settlement} to ${q.maturity} (${q.dayCount})`, [], rec.periods as number, 'periods');
        step('model', `${f} x expm1(-lnP / n)`, ['lnP', 'n'], model, unit);
        return formula;
      }
      const short = bill.days <= bill.basis / 2;
      formula = `bill bond-equivalent yield: ${short ? 'y = (1/DF(M) - 1) / a' : 'y from (1 + y/2)(1 + y (a - 1/2)) = 1/DF(M)'}, a = days / T`;
      step('days', `actual days ${settlement} to ${q.maturity}`, [], bill.days, 'days');
      step('T', 'days in the year after settlement (366 with 29 February)', [], bill.basis, 'days');
      step('a', 'days / T', ['days', 'T'], bill.days / bill.basis);
      step('g', 'expm1(-lnP)', ['lnP'], got('g'));
      step('model', short ? 'g / a' : '2 g / (a + sqrt(a^2 + (2a - 1) g))', ['g', 'a'], model, unit);
      return formula;
    },
    future: (q) => {
      const ca = q.convexity;
      const days = serialFromIso(q.end) - serialFromIso(q.start);
      const fp = 'price = 100 (1 - R - CA / 10,000), ';
      const caWords = q.convexityFill
        ? `${convexityFillText(q.convexityFill)}, at (100 - price) / 100 over ${days} days`
        : ca === 0 ? 'none' : 'as typed';
      const caValue = q.convexityFill ? modelConvexityBp(q.convexityFill, (100 - q.price) / 100, days, q.convexityFill.t1, q.convexityFill.t2) : ca;
      step('CA', caWords, [], caValue, 'bp');
      if (q.contract === '3M') {
        const tau = rec.tau as number;
        yfs.push(explainedYearFraction('tau', 'ACT/360', q.start, q.end, tau));
        const holiday = labels[0] === 'b0';
        if (holiday) {
          const w = rec.w as number;
          formula = `${fp}R = (DF(S) / DF(E) - 1) / tau, S a holiday: DF(S) = w DF(b0) + (1 - w) DF(b1)`;
          step('w', '(b1 - S) / (b1 - b0)', [], w);
          step('lnStart', 'ln(1 + w x expm1(ln DF(b0) - ln DF(b1))) + ln DF(b1)', ['w', ln(0), ln(1)], got('lnStart'), 'ln');
          step('g', 'expm1(lnStart - ln DF(E))', ['lnStart', ln(2)], got('g'));
        } else {
          const known = rec.lnKnown as number;
          formula = `${fp}R = (DF(S) / DF(E) - 1) / tau`;
          if (known !== 0) {
            step('ln known', 'fixed growth S to c', [], known, 'ln');
            step('g', 'expm1(ln known + ln DF(c) - ln DF(E))', ['ln known', ln(0), ln(1)], got('g'));
          } else step('g', 'expm1(ln DF(S) - ln DF(E))', [ln(0), ln(1)], got('g'));
        }
        step('R', 'g / tau', ['g', 'tau'], got('R'), ACT360);
      } else {
        const { weights, spans, knownSum } = rec as { weights: number[]; spans: number[]; knownSum: number };
        formula = `${fp}R = (known + sum w_i r_i) / N, N = ${days} days, r_i = expm1(ln DF(b_i) - ln DF(b_i+1)) x 360 / n_i`;
        if (knownSum !== 0) step('known', 'sum w_i x fixing', [], knownSum, 'days');
        weights.forEach((w, i) => {
          step(`n${i + 1}`, 'days to the next', [], spans[i]!, 'days');
          step(`w${i + 1}`, 'days at its rate', [], w, 'days');
          step(`r${i + 1}`, `expm1(${ln(i)} - ${ln(i + 1)}) x ${FUTURE_BASIS} / n${i + 1}`, [ln(i), ln(i + 1), `n${i + 1}`], got('r', i), ACT360);
        });
        sumStep('sum', [...(knownSum !== 0 ? [['known']] : []), ...weights.map((_, i) => [`w${i + 1}`, `r${i + 1}`])], 'days');
        step('R', `sum / ${days}`, ['sum'], got('R'), ACT360);
      }
      step('model', '100 (1 - R - CA / 10,000)', ['R', 'CA'], model, unit);
      return formula;
    },
  };
  const explain = KIND_STEPS[q.kind] as ((q: Quote) => string) | undefined;
  if (!explain) return fail(coreError('schema', `quotes[${ins.index}]`, `${q.kind} quotes do not explain their arithmetic yet`));
  formula = explain(q);
  let value = model;
  const cc = (conv as { compounding?: string }).compounding;
  if (figure === 'error') {
    const price = ins.unit === 'price';
    const d = price ? 'model - market' : '(model - market) x 10,000';
    formula = `${d}; ${formula}`;
    value = price ? model - ins.market : (model - ins.market) * 1e4;
    step('market', 'as quoted', [], ins.market, unit);
    step('difference', d, ['model', 'market'], value, price ? PRICE_UNIT : BP_UNIT);
  }
  return ok({
    quantity: figure === 'model' ? 'quote-model' : 'quote-error',
    formula,
    value,
    unit: figure === 'error' ? (ins.unit === 'price' ? PRICE_UNIT : BP_UNIT) : unit,
    conventions: {
      ...explainedConventions(curve, COMPOUNDINGS.includes(cc as Compounding) ? (cc as Compounding) : null, conv.unit === 'rate' ? conv.dayCount : 'dayCount' in q ? (q as { dayCount: DayCount }).dayCount : null),
      businessDay: (rec.quote as { businessDay?: string }).businessDay ?? 'unadjusted',
      calendar: (rec.quote as { calendar?: string | null }).calendar ?? 'none',
    },
    dates,
    yearFractions: yfs,
    reads,
    steps,
  });
}
