import { forwardOn, discountOn } from './query.ts';
import type { Curve } from './curve.ts';
import type { Compounding } from '../rates/compounding.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import { compareIso, type IsoDate } from '../time/date.ts';
import type { CurveDayCount } from '../time/dayCount.ts';
import { resolveMarketDate } from '../time/dateConventions.ts';

/** A forward between two dates with the discount factors it is read from. */
export interface ForwardBetween {
  readonly start: IsoDate;
  readonly end: IsoDate;
  /** DF(start) and DF(end) off the curve (unitless, per unit paid on that date). */
  readonly dfStart: number;
  readonly dfEnd: number;
  /** The forward discount factor DF(end) / DF(start). */
  readonly forwardDiscount: number;
  /** Year fraction of [start, end] under the asked day count. */
  readonly tau: number;
  /** The forward rate, decimal per year, in the asked compounding and day count. */
  readonly rate: number;
  readonly extrapolated: boolean;
}

/**
 * A forward rate between a start and an end given as people type them. The start is empty (the
 * settlement date), a tenor counted from settlement ("1Y") or a date; the end is a tenor counted
 * from the start ("6M": a forward six months long) or a date after the start. The rate solves
 * DF(start)/DF(end) over tau = yearFraction(dc, start, end) in compounding c (forwardOn). Tenors
 * are resolved by the conventions layer (resolveMarketDate), as everywhere in the engine.
 */
export function forwardBetween(curve: Curve, startText: string, endText: string, c: Compounding, dc: CurveDayCount): Result<ForwardBetween> {
  const s = startText.trim();
  const e = endText.trim();
  const startAt = s === '' ? null : resolveMarketDate(curve.settlement, s, undefined, 'start');
  const start = startAt === null ? curve.settlement : startAt.ok ? startAt.value : null;
  if (start === null) return fail(coreError('schema', 'start', `Start: "${s.slice(0, 20)}" is neither a tenor from settlement such as "1Y" nor a date YYYY-MM-DD; leave it empty for the settlement date`));
  if (compareIso(start, curve.settlement) < 0) return fail(coreError('before-settlement', 'start', `Start: ${start} is before the settlement date ${curve.settlement}`));
  const endAt = resolveMarketDate(start, e, undefined, 'end');
  const end = endAt.ok ? endAt.value : null;
  if (end === null) return fail(coreError('schema', 'end', `End: "${e.slice(0, 20)}" is neither a tenor from the start such as "6M" nor a date YYYY-MM-DD`));
  if (compareIso(end, start) <= 0) return fail(coreError('empty-period', 'end', `End: ${end} must come after the start ${start}`));
  const a = discountOn(curve, start, 'start');
  if (!a.ok) return a;
  const b = discountOn(curve, end, 'end');
  if (!b.ok) return b;
  const f = forwardOn(curve, start, end, c, dc);
  if (!f.ok) return f;
  return ok({ start, end, dfStart: a.value.discount, dfEnd: b.value.discount, forwardDiscount: b.value.discount / a.value.discount, tau: f.value.tau, rate: f.value.rate, extrapolated: f.value.extrapolated });
}
