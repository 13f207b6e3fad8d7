import { coreError, type CoreError } from '../result.ts';
import { isIsoDate } from '../time/date.ts';
import { CURVE_DAY_COUNTS, isCurveDayCount, type CurveDayCount } from '../time/dayCount.ts';
import { parseTenor } from '../time/tenor.ts';
import { MoneyDecimal, parseMoney } from './strategyMoney.ts';
import { isPlainObject } from '../document/plainObject.ts';

/**
 * Inputs of the roll-versus-term analysis, kept in the workspace document under the top-level
 * key `strategy`. Rates are decimals per year (0.045 = 4.5 %); every rate of the roll legs is a
 * simple money-market rate on `rollDayCount`. Money is a decimal string in the workspace's
 * currency.
 */

/** Roll instruments on offer: money-market tenors. */
export const ROLL_TENORS = ['1M', '3M', '6M', '1Y'] as const;
export type RollTenor = (typeof ROLL_TENORS)[number];
export const isRollTenor = (x: unknown): x is RollTenor => typeof x === 'string' && (ROLL_TENORS as readonly string[]).includes(x);

/** Coupon frequencies per year of the term bonds. */
export const STRATEGY_FREQUENCIES = [1, 2, 4, 12] as const;
export type StrategyFrequency = (typeof STRATEGY_FREQUENCIES)[number];

/** How the user's own short-rate path for legs 2..n is made. */
export const PATH_FILLS = ['forwards', 'constant', 'ramp', 'typed'] as const;
export type PathFill = (typeof PATH_FILLS)[number];

/**
 * The views of the future the analysis offers. A scenario view is `scenario:NAME`, NAME the name
 * of a scenario curve handed to the analysis (the curve moves to it today, then stays unchanged by
 * time to maturity); `scenario-fwd:NAME` is its alternative reading, the scenario's forwards realised.
 */
export const BASE_VIEWS = ['forwards', 'unchanged', 'path', 'shift'] as const;
export type BaseView = (typeof BASE_VIEWS)[number];
export type StrategyViewId = BaseView | `scenario:${string}` | `scenario-fwd:${string}`;
export const isStrategyViewId = (x: unknown): x is StrategyViewId =>
  typeof x === 'string' &&
  ((BASE_VIEWS as readonly string[]).includes(x) ||
    (x.startsWith('scenario:') && x.length > 'scenario:'.length) ||
    (x.startsWith('scenario-fwd:') && x.length > 'scenario-fwd:'.length));

/**
 * The user's short-rate path for the roll legs after the first (leg 1 is always today's spot,
 * since it is bought today). Rates are decimals, simple on the roll day count.
 * - `forwards`: each leg at today's forward for its period;
 * - `constant`: every leg at `constant`;
 * - `ramp`: leg 2 at `rampFrom`, leg n at `rampTo`, linear in the leg number between;
 * - `typed`: `legs[i]` is the rate of leg i + 2; legs beyond the list are filled from forwards
 *   (with a warning), extra entries are ignored (with a warning).
 */
export interface RatePath {
  readonly fill: PathFill;
  readonly constant: number;
  readonly rampFrom: number;
  readonly rampTo: number;
  readonly legs: readonly number[];
}

export interface StrategyInputs {
  /** Money to invest: a positive decimal string such as "1000000" or "250000.50". */
  readonly amount: string;
  /** The horizon: a tenor from settlement ("2Y", "18M") or a date YYYY-MM-DD. */
  readonly horizon: string;
  /** The roll instrument's tenor; the final leg is cut short at the horizon. */
  readonly rollTenor: RollTenor;
  /** Day count of the roll legs' simple money-market rates. */
  readonly rollDayCount: CurveDayCount;
  /** Coupons per year of the par bond maturing at the horizon (alternative b). */
  readonly bondFrequency: StrategyFrequency;
  /** Maturity of the riding bond (alternative c): a tenor from settlement or a date, after the horizon. */
  readonly ridingMaturity: string;
  /** Coupons per year of the riding bond. */
  readonly ridingFrequency: StrategyFrequency;
  /** The chosen view: the result sentence, growth chart and break-evens use it. */
  readonly view: StrategyViewId;
  readonly path: RatePath;
  /** The parallel shift of the forward path for the `shift` view, basis points (100 bp = 0.01). */
  readonly shiftBp: number;
  /** The amount's currency: an ISO 4217 alphabetic code such as "USD", or "" for none (a generic money sign is shown). */
  readonly currency: string;
}

/** Defaults, used for every field the document leaves out. */
export const DEFAULT_STRATEGY: StrategyInputs = {
  amount: '1000000',
  horizon: '2Y',
  rollTenor: '3M',
  rollDayCount: 'ACT/360',
  bondFrequency: 2,
  ridingMaturity: '5Y',
  ridingFrequency: 2,
  view: 'unchanged',
  path: { fill: 'forwards', constant: 0.03, rampFrom: 0.03, rampTo: 0.04, legs: [] },
  shiftBp: 100,
  currency: '',
};

/** ISO 4217 alphabetic codes are three capital Latin letters (the standard's form; the list of codes itself is not checked). */
export const isCurrencyCode = (v: unknown): v is string => typeof v === 'string' && /^[A-Z]{3}$/.test(v);

/** Bounds: path rates -0.10..1.0 (decimals); shift -1000..1000 bp; at most 400 typed legs. */
export const PATH_RATE_MIN = -0.1;
export const PATH_RATE_MAX = 1.0;
export const SHIFT_BP_MAX = 1000;
export const MAX_TYPED_LEGS = 400;

const STRATEGY_KEYS = ['amount', 'horizon', 'rollTenor', 'rollDayCount', 'bondFrequency', 'ridingMaturity', 'ridingFrequency', 'view', 'path', 'shiftBp', 'currency'];
const PATH_KEYS = ['fill', 'constant', 'rampFrom', 'rampTo', 'legs'];

const show = (v: unknown): string =>
  v === null ? 'null' : Array.isArray(v) ? 'an array' : typeof v === 'string' ? `"${v.slice(0, 40)}"` : typeof v === 'object' ? 'an object' : String(v);

/** True when the text is a tenor ("2Y") or an ISO date. */
export const isHorizonText = (text: string): boolean => parseTenor(text) !== null || isIsoDate(text);

export interface StrategyValidation {
  /** Always usable: each field that is missing or invalid takes its default. */
  readonly strategy: StrategyInputs;
  /** One error per invalid field, its path starting `strategy.`; empty when all is valid. */
  readonly errors: readonly CoreError[];
}

/**
 * Validates the document's `strategy` value. Missing fields (and a missing `strategy`) take the
 * defaults of DEFAULT_STRATEGY; an invalid field is reported with its path (`strategy.horizon: ...`)
 * and what would be valid, and takes its default in the returned strategy, so the caller can go on
 * while showing the error. Nothing here depends on the curve: whether the horizon falls after the
 * settlement date and before the riding maturity is checked by `analyseRollVsTerm`.
 */
export function validateStrategy(raw: unknown): StrategyValidation {
  const errors: CoreError[] = [];
  if (raw === undefined) return { strategy: DEFAULT_STRATEGY, errors };
  if (!isPlainObject(raw)) {
    errors.push(coreError('schema', 'strategy', `strategy: must be an object such as {"amount": "1000000", "horizon": "2Y", "rollTenor": "3M"}, not ${show(raw)}`));
    return { strategy: DEFAULT_STRATEGY, errors };
  }
  for (const key of Object.keys(raw)) {
    if (!STRATEGY_KEYS.includes(key)) errors.push(coreError('schema', `strategy.${key}`, `strategy.${key}: unknown field; strategy takes ${STRATEGY_KEYS.join(', ')}`));
  }
  const d = DEFAULT_STRATEGY;
  const pick = <T>(key: string, fallback: T, check: (v: unknown) => string | null): T => {
    const v = raw[key];
    if (v === undefined) return fallback;
    const why = check(v);
    if (why === null) return v as T;
    errors.push(coreError(why.startsWith('!') ? 'unknown-identifier' : 'schema', `strategy.${key}`, `strategy.${key}: ${why.replace(/^!/, '')}`));
    return fallback;
  };
  const amount = pick('amount', d.amount, (v) => {
    if (typeof v !== 'string') return `must be a decimal text such as "1000000", not ${show(v)}`;
    const m = parseMoney(v);
    return m.ok ? null : m.message;
  });
  const horizon = pick('horizon', d.horizon, (v) =>
    typeof v === 'string' && isHorizonText(v) ? null : `must be a tenor such as "2Y" or "18M", or a date YYYY-MM-DD, not ${show(v)}`,
  );
  const rollTenor = pick('rollTenor', d.rollTenor, (v) => (isRollTenor(v) ? null : `!must be one of ${ROLL_TENORS.join(', ')}, not ${show(v)}`));
  const rollDayCount = pick('rollDayCount', d.rollDayCount, (v) =>
    isCurveDayCount(v) ? null : `!must be one of ${CURVE_DAY_COUNTS.join(', ')}, not ${show(v)}`,
  );
  const freq = (v: unknown): string | null =>
    (STRATEGY_FREQUENCIES as readonly unknown[]).includes(v) ? null : `must be one of ${STRATEGY_FREQUENCIES.join(', ')} coupons a year, not ${show(v)}`;
  const bondFrequency = pick('bondFrequency', d.bondFrequency, freq);
  const ridingMaturity = pick('ridingMaturity', d.ridingMaturity, (v) =>
    typeof v === 'string' && isHorizonText(v) ? null : `must be a tenor such as "5Y" or a date YYYY-MM-DD, not ${show(v)}`,
  );
  const ridingFrequency = pick('ridingFrequency', d.ridingFrequency, freq);
  const view = pick('view', d.view, (v) =>
    isStrategyViewId(v) ? null : `!must be one of ${BASE_VIEWS.join(', ')} or "scenario:NAME" or "scenario-fwd:NAME", not ${show(v)}`,
  );
  const shiftBp = pick('shiftBp', d.shiftBp, (v) =>
    typeof v === 'number' && Number.isFinite(v) && Math.abs(v) <= SHIFT_BP_MAX ? null : `must be a number of basis points from -${SHIFT_BP_MAX} to ${SHIFT_BP_MAX}, not ${show(v)}`,
  );
  const currency = pick('currency', d.currency, (v) => (v === '' || isCurrencyCode(v) ? null : `must be an ISO 4217 code of three capital letters such as "USD" or "EUR", or "" for none, not ${show(v)}`));
  const path = checkPath(raw.path, errors);
  return { strategy: { amount, horizon, rollTenor, rollDayCount, bondFrequency, ridingMaturity, ridingFrequency, view, path, shiftBp, currency }, errors };
}

const rateWhy = (v: unknown): string | null => {
  if (typeof v !== 'number' || !Number.isFinite(v)) return `must be a rate as a decimal (0.045 = 4.5 %), not ${show(v)}`;
  if (v < PATH_RATE_MIN || v > PATH_RATE_MAX) {
    return `must be a decimal rate from ${PATH_RATE_MIN} to ${PATH_RATE_MAX}, not ${v}${v > 1 ? '; rates are decimals: 0.05 = 5%' : ''}`;
  }
  return null;
};

function checkPath(raw: unknown, errors: CoreError[]): RatePath {
  const d = DEFAULT_STRATEGY.path;
  if (raw === undefined) return d;
  if (!isPlainObject(raw)) {
    errors.push(coreError('schema', 'strategy.path', `strategy.path: must be an object such as {"fill": "constant", "constant": 0.04}, not ${show(raw)}`));
    return d;
  }
  for (const key of Object.keys(raw)) {
    if (!PATH_KEYS.includes(key)) errors.push(coreError('schema', `strategy.path.${key}`, `strategy.path.${key}: unknown field; path takes ${PATH_KEYS.join(', ')}`));
  }
  let fill = d.fill;
  if (raw.fill !== undefined) {
    if (typeof raw.fill === 'string' && (PATH_FILLS as readonly string[]).includes(raw.fill)) fill = raw.fill as PathFill;
    else errors.push(coreError('unknown-identifier', 'strategy.path.fill', `strategy.path.fill: must be one of ${PATH_FILLS.join(', ')}, not ${show(raw.fill)}`));
  }
  const rate = (key: 'constant' | 'rampFrom' | 'rampTo'): number => {
    const v = raw[key];
    if (v === undefined) return d[key];
    const why = rateWhy(v);
    if (why === null) return v as number;
    errors.push(coreError('range', `strategy.path.${key}`, `strategy.path.${key}: ${why}`));
    return d[key];
  };
  const constant = rate('constant');
  const rampFrom = rate('rampFrom');
  const rampTo = rate('rampTo');
  let legs: number[] = [];
  if (raw.legs !== undefined) {
    if (!Array.isArray(raw.legs) || raw.legs.length > MAX_TYPED_LEGS) {
      errors.push(coreError('schema', 'strategy.path.legs', `strategy.path.legs: must be a list of at most ${MAX_TYPED_LEGS} decimal rates (legs 2, 3, ...), not ${show(raw.legs)}`));
    } else {
      legs = raw.legs.map((v: unknown, i: number) => {
        const why = rateWhy(v);
        if (why === null) return v as number;
        errors.push(coreError('range', `strategy.path.legs[${i}]`, `strategy.path.legs[${i}] (leg ${i + 2}): ${why}`));
        return 0;
      });
      if (legs.length !== raw.legs.length || errors.some((e) => e.path.startsWith('strategy.path.legs['))) legs = [];
    }
  }
  return { fill, constant, rampFrom, rampTo, legs };
}

export type TextParse<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly message: string };

/** A typed currency: empty for none, else three letters read in capitals ("usd" is USD). */
export function parseCurrencyText(text: string): TextParse<string> {
  const t = text.trim().toUpperCase();
  return t === '' || isCurrencyCode(t) ? { ok: true, value: t } : { ok: false, message: 'an ISO 4217 code is three letters such as USD, EUR or GBP; leave it empty for none' };
}

/**
 * A rate typed in percent ("4.25" or "4.25 %") as a decimal (0.0425), exact in decimal before
 * the one conversion to float64; from PATH_RATE_MIN to PATH_RATE_MAX.
 */
export function parsePercentText(text: string): TextParse<number> {
  const t = text.trim().replace(/\s*%$/, '');
  if (!/^-?\d{1,3}(\.\d{1,6})?$/.test(t)) return { ok: false, message: `type a rate in percent such as 4.25 (meaning 4.25 %), not "${text.slice(0, 20)}"` };
  const value = new MoneyDecimal(t).div(100).toNumber();
  if (value < PATH_RATE_MIN || value > PATH_RATE_MAX) return { ok: false, message: `a rate from ${PATH_RATE_MIN * 100} % to ${PATH_RATE_MAX * 100} %, not ${t} %` };
  return { ok: true, value };
}

/** A decimal rate as percent text for an input: 0.0425 -> "4.25" (up to `digits` decimals, default 6, no trailing zeros). */
export const percentText = (rate: number, digits = 6): string => new MoneyDecimal(rate).times(100).toDecimalPlaces(digits).toFixed();

/** Basis points typed as a number ("-25", "12.5"), from -SHIFT_BP_MAX to SHIFT_BP_MAX. */
export function parseBpText(text: string): TextParse<number> {
  const t = text.trim().replace(/\s*bp$/i, '');
  if (!/^[-+]?\d{1,4}(\.\d{1,4})?$/.test(t)) return { ok: false, message: `type basis points such as 50 or -25, not "${text.slice(0, 20)}"` };
  const value = Number(t);
  if (Math.abs(value) > SHIFT_BP_MAX) return { ok: false, message: `from -${SHIFT_BP_MAX} to ${SHIFT_BP_MAX} bp, not ${t}` };
  return { ok: true, value };
}

/** Checks a horizon or maturity text (tenor or date) for an input field. */
export function parseHorizonText(text: string): TextParse<string> {
  const t = text.trim().toUpperCase();
  if (isHorizonText(t)) return { ok: true, value: t };
  return { ok: false, message: `type a tenor such as 2Y or 18M, or a date YYYY-MM-DD, not "${text.slice(0, 20)}"` };
}

/** Checks an amount text for an input field (see parseMoney). */
export function parseAmountText(text: string): TextParse<string> {
  const m = parseMoney(text);
  return m.ok ? { ok: true, value: text.trim() } : { ok: false, message: m.message };
}
