import type { FraQuote } from '../document/types.ts';
import { civilFromIso, type CivilDate } from '../time/date.ts';
import { yearFraction } from '../time/dayCount.ts';
import { ForwardDeposit } from './deposit.ts';
import { DISCOUNTING_AND_PROJECTING, type Instrument } from './instrument.ts';

/**
 * A forward rate agreement on one curve: the FRA rate F (simple on the index's day count) fixes
 * DF(S) / DF(E) = 1 + F tau(S, E) on the curve that projects its index (MARKET-CONVENTIONS.md f:
 * "DF(end) = DF(start) / (1 + F tau)"; QuantLib's FraRateHelper, its par form). The instrument is
 * the forward deposit's: 0 at t_S and 1 + F tau at t_E against DF(S) read off the curve, the node
 * at E; DF(S) comes from shorter quotes or the interpolation (a start between nodes makes the
 * bootstrap non-local). On today's one curve the index's curve is the curve that also discounts
 * (`DISCOUNTING_AND_PROJECTING`). The settlement amount paid at the start, N (L - F) tau / (1 + L tau),
 * is zero at the fair rate and plays no part in the node.
 */
export function compileFra(q: FraQuote, t: number, time: (d: CivilDate) => number): Instrument {
  const tau = yearFraction(q.dayCount, q.start, q.end, { termination: q.end });
  return new ForwardDeposit(q, t, [time(civilFromIso(q.start)), t], tau, q.rate, DISCOUNTING_AND_PROJECTING);
}
