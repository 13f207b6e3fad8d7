import type { Instrument } from '../instruments/instrument.ts';
import { coreError, fail, type Result } from '../result.ts';
import { PRICE_MAX } from './fields.ts';
import type { IsoDate } from '../time/date.ts';
import type { QuoteDates } from './types.ts';

/** The first node's rate guess when the quote gives no rate (a price quote): 3%. */
const PRICE_QUOTE_FIRST_RATE = 0.03;

/** The bootstrap's first-node rate for kinds whose rate quotes are near zero rates: the quoted rate, or 3% for a price. */
export const quotedRateOrDefault = (ins: Instrument): number => (ins.unit === 'rate' ? ins.market : PRICE_QUOTE_FIRST_RATE);


/** The compounding of a periodic rate paid `frequency` times a year (1, 2, 4 or 12, checked by the schema). */
export const compoundingOfFrequency = (frequency: number): 'annual' | 'semiannual' | 'quarterly' | 'monthly' =>
  frequency === 2 ? 'semiannual' : frequency === 4 ? 'quarterly' : frequency === 12 ? 'monthly' : 'annual';

/**
 * Dollar duration of an instrument's flows at the flat continuously compounded yield c that
 * prices them at the target: sum a_j t_j e^(-c t_j) (Newton on c from 0). Used by the smooth
 * fit to turn a kind's price error into a yield error when the kind has no yield formula of its own.
 */
export const flatDollarDuration = (ins: Instrument): number => flatDollarDurationOf(ins.times, ins.amounts, ins.target);

/** `flatDollarDuration` of flows given as arrays: amounts a_j at times t_j against a target. */
export function flatDollarDurationOf(times: readonly number[], amounts: ArrayLike<number>, target: number): number {
  let c = 0;
  for (let iter = 0; iter < 100; iter++) {
    let p = 0;
    let dp = 0;
    for (let j = 0; j < times.length; j++) {
      const v = amounts[j]! * Math.exp(-c * times[j]!);
      p += v;
      dp += times[j]! * v;
    }
    const step = (p - target) / dp;
    c += step;
    if (Math.abs(step) < 1e-15) break;
  }
  let dd = 0;
  for (let j = 0; j < times.length; j++) dd += times[j]! * amounts[j]! * Math.exp(-c * times[j]!);
  return dd;
}

/** A moved price within (0, PRICE_MAX], or the error a scenario reports for it. */
export function movedPrice<Q extends { readonly index: number }>(q: Q, field: string, price: number, moved: Q): Result<Q> {
  if (price > 0 && price <= PRICE_MAX) return { ok: true, value: moved };
  const path = `quotes[${q.index}].${field}`;
  return fail(coreError('range', path, `${path}: the scenario moves the price to ${price}, outside (0, ${PRICE_MAX}] per 100; use a smaller shift`, q.index));
}

/** A quote settled at spot (bond, bill, zero): it starts at its `settle` (else the valuation date) and ends at its maturity. */
export const spotSettledDates = (q: { readonly settle?: IsoDate; readonly maturity: IsoDate }, valuation: IsoDate): QuoteDates => ({ start: q.settle ?? valuation, end: q.maturity, payment: null });
