import { coreError, fail, ok, type CoreError, type Result } from '../result.ts';
import { compareIso, isMonthEnd, parseIsoDate, type IsoDate } from '../time/date.ts';
import { DAY_COUNTS, isDayCount, type DayCount } from '../time/dayCount.ts';
import { COUPON_MAX, FREQUENCIES, PRICE_MAX, RATE_MAX, RATE_MIN } from '../document/validate.ts';

/**
 * A bond the user asks about (not a curve quote): a fixed coupon (decimal per year) paid
 * `frequency` times a year to `maturity`, accruing on `dayCount`; optionally a market clean price
 * per 100 face or a market yield (decimal, ICMA, compounded `frequency` times a year).
 */
export interface BondInput {
  readonly maturity: IsoDate;
  readonly coupon: number;
  readonly frequency: number;
  readonly dayCount: DayCount;
  /** Keep coupon dates on month ends (default: when the maturity is a month end). */
  readonly eom?: boolean;
  readonly cleanPrice?: number;
  readonly yield?: number;
}

export interface CheckedBond {
  readonly maturity: IsoDate;
  readonly coupon: number;
  readonly frequency: number;
  readonly dayCount: DayCount;
  readonly eom: boolean;
  readonly cleanPrice: number | null;
  readonly yield: number | null;
}

/** Checks a bond against a settlement date; every error names the field and what would be valid. */
export function checkBondInput(b: BondInput, settlement: IsoDate, path = 'bond'): Result<CheckedBond> {
  const errors: CoreError[] = [];
  const civil = typeof b.maturity === 'string' ? parseIsoDate(b.maturity) : null;
  if (!civil) errors.push(coreError('schema', `${path}.maturity`, `${path}.maturity must be a date YYYY-MM-DD or a tenor such as 10Y, not ${String(b.maturity)}`));
  else if (compareIso(b.maturity, settlement) <= 0) {
    errors.push(coreError('before-settlement', `${path}.maturity`, `${path}.maturity ${b.maturity} must be after the settlement date ${settlement}`));
  }
  if (typeof b.coupon !== 'number' || !Number.isFinite(b.coupon) || b.coupon < 0 || b.coupon > COUPON_MAX) {
    const hint = typeof b.coupon === 'number' && b.coupon > 1 && b.coupon <= 100 ? ' (coupons are decimals: 0.05 = 5%)' : '';
    errors.push(coreError('range', `${path}.coupon`, `${path}.coupon must be a number from 0 to ${COUPON_MAX}, not ${String(b.coupon)}${hint}`));
  }
  if (!(FREQUENCIES as readonly number[]).includes(b.frequency)) {
    errors.push(coreError('range', `${path}.frequency`, `${path}.frequency must be one of ${FREQUENCIES.join(', ')} payments a year, not ${String(b.frequency)}`));
  }
  if (!isDayCount(b.dayCount)) {
    errors.push(coreError('unknown-identifier', `${path}.dayCount`, `${path}.dayCount must be one of ${DAY_COUNTS.join(', ')}, not ${String(b.dayCount)}`));
  }
  if (b.cleanPrice !== undefined && b.yield !== undefined) {
    errors.push(coreError('schema', path, `${path}: give a market clean price or a market yield, not both`));
  }
  if (b.cleanPrice !== undefined && !(Number.isFinite(b.cleanPrice) && b.cleanPrice > 0 && b.cleanPrice <= PRICE_MAX)) {
    errors.push(coreError('range', `${path}.price`, `${path}.price (clean, per 100 face) must be above 0 up to ${PRICE_MAX}, not ${String(b.cleanPrice)}`));
  }
  if (b.yield !== undefined && !(Number.isFinite(b.yield) && b.yield >= RATE_MIN && b.yield <= RATE_MAX)) {
    const hint = typeof b.yield === 'number' && b.yield > 1 && b.yield <= 100 ? ' (yields are decimals: 0.05 = 5%)' : '';
    errors.push(coreError('range', `${path}.yield`, `${path}.yield must be a decimal from ${RATE_MIN} to ${RATE_MAX}, not ${String(b.yield)}${hint}`));
  }
  if (errors.length > 0) return fail(...errors);
  return ok({
    maturity: b.maturity,
    coupon: b.coupon,
    frequency: b.frequency,
    dayCount: b.dayCount,
    eom: b.eom ?? isMonthEnd(civil!),
    cleanPrice: b.cleanPrice ?? null,
    yield: b.yield ?? null,
  });
}
