import { buildFromWorkspace, type BuildOptions, type CurveBuild } from '../bootstrap/build.ts';
import { billDiscountYieldFromPrice, billPriceFromDiscountYield } from '../instruments/bill.ts';
import { bondDirtyFromYield, bondSchedule, bondYieldFromDirty } from '../instruments/bond.ts';
import { lnDiscountFromRate, rateFromLnDiscount } from '../rates/compounding.ts';
import { coreError, fail, ok, type CoreError, type Result } from '../result.ts';
import { daysBetween } from '../time/date.ts';
import { curveTime, yearFraction } from '../time/dayCount.ts';
import type { Quote, Workspace } from '../document/types.ts';
import { PRICE_MAX } from '../document/validate.ts';
import { shiftAt, type ResolvedShift } from './scenarioShape.ts';

const BP = 1e-4;

/**
 * One quote moved by d = Delta(T) (decimal) at its maturity T on the curve's axis:
 *  - a rate quote (deposit rate, swap rate, bill discount yield, zero rate, bond yield) moves by d
 *    in its own convention;
 *  - a price quote moves its own yield by d and is repriced:
 *      bill  price = 100 (1 - y days/360)            (bank discount yield, US Treasury formula)
 *      zero  price = 100 DF(r + d), r the zero rate in the quote's compounding and day count
 *      bond  clean = dirty(y + d) - accrued, y the ICMA yield of the quoted dirty price
 *            (bondYieldFromDirty / bondDirtyFromYield).
 */
export function shiftQuote(q: Quote, d: number, settlement: string): Result<Quote> {
  const path = (f: string): string => `quotes[${q.index}].${f}`;
  const badPrice = (field: string, price: number): Result<Quote> =>
    fail(coreError('range', path(field), `${path(field)}: the scenario moves the price to ${price}, outside (0, ${PRICE_MAX}] per 100; use a smaller shift`, q.index));
  switch (q.kind) {
    case 'deposit':
    case 'swap':
      return ok({ ...q, rate: q.rate + d });
    case 'bill': {
      if (q.discountYield !== null) return ok({ ...q, discountYield: q.discountYield + d });
      const days = daysBetween(settlement, q.maturity);
      const price = billPriceFromDiscountYield(billDiscountYieldFromPrice(q.price!, days) + d, days);
      return price > 0 && price <= PRICE_MAX ? ok({ ...q, price }) : badPrice('price', price);
    }
    case 'zero': {
      if (q.rate !== null) return ok({ ...q, rate: q.rate + d });
      const tau = yearFraction(q.dayCount, settlement, q.maturity, { termination: q.maturity });
      const r = rateFromLnDiscount(Math.log(q.price! / 100), q.compounding, tau);
      const price = 100 * Math.exp(lnDiscountFromRate(r + d, q.compounding, tau));
      return price > 0 && price <= PRICE_MAX ? ok({ ...q, price }) : badPrice('price', price);
    }
    case 'bond': {
      if (q.yield !== null) return ok({ ...q, yield: q.yield + d });
      const s = bondSchedule(q, settlement);
      const y = bondYieldFromDirty(s, q.cleanPrice! + s.accrued);
      if (y === null) {
        return fail(coreError('no-solution', path('cleanPrice'), `${path('cleanPrice')}: no yield gives the clean price ${q.cleanPrice}, so the scenario cannot move it; check the price`, q.index));
      }
      const clean = bondDirtyFromYield(s, y + d).price - s.accrued;
      return clean > 0 && clean <= PRICE_MAX ? ok({ ...q, cleanPrice: clean }) : badPrice('cleanPrice', clean);
    }
  }
}

/** The workspace with every quote moved by the shift at its maturity (see {@link shiftQuote}); errors name the quotes that cannot move. */
export function shiftWorkspaceQuotes(ws: Workspace, shift: ResolvedShift): Result<Workspace> {
  const quotes: Quote[] = [];
  const errors: CoreError[] = [];
  for (const q of ws.quotes) {
    const T = curveTime(ws.curve.dayCount, ws.settlement, q.maturity);
    const moved = shiftQuote(q, shiftAt(shift, T) * BP, ws.settlement);
    if (moved.ok) quotes.push(moved.value);
    else errors.push(...moved.errors);
  }
  if (errors.length > 0) return fail(...errors);
  return ok({ ...ws, quotes });
}

/** Moves the quotes and bootstraps again with the engine's `buildFromWorkspace`. */
export function buildQuoteScenario(ws: Workspace, shift: ResolvedShift, options: BuildOptions = {}): Result<CurveBuild> {
  const moved = shiftWorkspaceQuotes(ws, shift);
  if (!moved.ok) return moved;
  return ok(buildFromWorkspace(moved.value, options));
}
