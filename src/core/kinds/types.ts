import type { ConvexityModel } from '../instruments/convexity.ts';

/** What a quote's reader may take from the document beyond the quote: the futures' convexity model and the workspace's overnight fixings. */
export interface DocumentContext {
  /** `curve.futuresConvexity`: fills a future's adjustment when the quote types none. */
  readonly futuresConvexity?: ConvexityModel;
  /** The document's `fixings`: overnight rates (decimals) by business day, before the valuation date. */
  readonly fixings?: Readonly<Record<string, number>>;
}
import type { Quote } from '../document/types.ts';
import type { QuoteColumn } from '../input/quoteRow.ts';
import type { CurveRole, CurveRoles, Instrument } from '../instruments/instrument.ts';
import type { Compounding } from '../rates/compounding.ts';
import type { CoreError, Result } from '../result.ts';
import type { CalendarContext } from '../time/calendars.ts';
import type { CivilDate, IsoDate } from '../time/date.ts';
import type { DayCount } from '../time/dayCount.ts';
import type { RawQuote } from './fields.ts';

/**
 * How a quote is quoted, as a value the UI formats in one place: a price per 100 face (clean for
 * a bond), or a rate (decimal per year) with its compounding and day count. A bill's discount
 * yield is `bank-discount`: 1 - DF = d days / 360 (US Treasury), not a compounding of compounding.ts;
 * a bill's bond-equivalent yield is `bill-equivalent` (simple on 365 or 366 days up to half a year,
 * Treasury's half-year-compounded rule beyond: instruments/parYield.ts).
 */
export type QuoteConvention =
  | {
      readonly unit: 'price';
      readonly clean: boolean;
      /**
       * A futures price, 100 minus the futures rate in percent: the rate is simple on ACT/360 and
       * either compounded daily over the reference quarter or averaged over the month.
       */
      readonly futuresRate?: 'compounded' | 'averaged';
    }
  | { readonly unit: 'rate'; readonly compounding: Compounding | 'bank-discount' | 'bill-equivalent'; readonly dayCount: DayCount };

/** A fixed leg's convention: payments a year, accrual day count, end-of-month rule. */
export interface FixedLegConvention {
  readonly frequency: number;
  readonly dayCount: DayCount;
  readonly eom: boolean;
}

/**
 * A quote's "own yield": the yield a trader moves when bumping that quote. `toYield` maps a
 * market value in the quote's unit to its own yield (decimal per year), `fromYield` back; both are
 * exact inverses (to rounding). `label` names the yield with its compounding and day count.
 */
export interface QuoteYield {
  toYield(value: number): number;
  fromYield(y: number): number;
  readonly label: string;
}

/**
 * Everything the engine knows about one quote kind, in one module (src/core/kinds/<kind>.ts),
 * registered in src/core/kinds/registry.ts. The rest of the engine and the UI look a kind up
 * here and never switch on its name; test/core/kinds/registry.test.ts fails when a kind of
 * QUOTE_KINDS lacks a module or a module lacks a part.
 */
export interface QuoteKindModule<Q extends Quote = Quote> {
  readonly kind: Q['kind'];

  /** The document's schema of the kind: its fields, their constant defaults, and its reader. */
  readonly schema: {
    /** Fields a quote of the kind accepts besides `kind`, `tenor`, `maturity` and `enabled`. */
    readonly fields: readonly string[];
    /** Defaults of optional fields that do not depend on the quote (the sheet shows them faintly). */
    readonly defaults: { readonly frequency?: number; readonly dayCount?: DayCount; readonly compounding?: Compounding };
    /**
     * Reads the kind's own fields of a raw quote whose common fields were read: `base` its path,
     * `maturity` null when the maturity was wrong (then `m` is the settlement as a stand-in).
     * `settlement` the document's settlement date (a kind whose dates count from it: the OIS's
     * spot lag and schedule). `calendars` the workspace's own calendars and its edits of the
     * built-in ones (absent when it has none). Pushes path-named errors; returns the typed quote or null.
     */
    read(raw: RawQuote, base: string, index: number, maturity: IsoDate | null, m: IsoDate, tenor: string | null, enabled: boolean, errors: CoreError[], settlement?: IsoDate, calendars?: CalendarContext, context?: DocumentContext): Q | null;
  };

  /** How the quote sheet's columns fill the kind's fields. */
  readonly sheet: {
    /**
     * The field the Rate / yield column fills, and what that rate is called in messages; null for a
     * kind quoted by price only (a future: the Price column holds its price), whose `rateWhat` names that price.
     */
    readonly rateField: string | null;
    readonly rateWhat: string;
    /** The field the Price column fills, or null when the kind has no price quote. */
    readonly priceField: string | null;
    /** The column marked when a row gives neither a rate nor a price. */
    readonly missingValue: 'rate' | 'price';
    readonly coupon: boolean;
    readonly frequency: boolean;
    /** Whether the Day count column applies: `yes`, only `with-rate`, or refused with a reason. */
    readonly dayCount: 'yes' | 'with-rate' | { readonly refuse: string };
    /**
     * Optional, for a kind dated by its own fields (`ownDates`): how the Maturity cell reads into
     * them (a future's `2027-03` or `2027-03 1M`: month and contract) and is written back from them.
     */
    readonly maturityCell?: {
      read(text: string): { readonly ok: true; readonly fields: Readonly<Record<string, unknown>> } | { readonly ok: false; readonly message: string };
      write(raw: Readonly<Record<string, unknown>>): string;
    };
  };

  /** What a pasted block may say for the kind: words for the kind itself, and header words of its own fields. */
  readonly paste: {
    /** Lower-case words read as this kind besides its own name (plurals, short forms). */
    readonly kindWords: readonly string[];
    /** Header words (lower case, letters only) naming a sheet column in this kind's terms. */
    readonly headerWords: Readonly<Record<string, QuoteColumn>>;
  };

  /**
   * Compiles a validated quote: `settlement` and `s` the settlement date, `m` the quote's
   * maturity parsed, `t` its pillar time on the curve's clock `time`; `shared` what `share` made
   * for the market (undefined without one, or when compiling a quote alone).
   */
  compile(q: Q, settlement: IsoDate, s: CivilDate, m: CivilDate, t: number, time: (d: CivilDate) => number, shared: unknown): Instrument;
  /**
   * Optional: work shared by the market's quotes of the kind, made once per market before they
   * are compiled (a swap ladder's fixed legs). Given the kind's enabled quotes with their maturities.
   */
  share?(settlement: CivilDate, time: (d: CivilDate) => number, quotes: readonly (readonly [Q, CivilDate])[]): unknown;

  /** The curves the kind's instruments read, by role, and the role whose curve its pillar is a node of. */
  readonly curves: CurveRoles;
  readonly nodeRole: CurveRole;

  /** How the quote is quoted (unit, compounding, day count). */
  convention(q: Q): QuoteConvention;

  /** The name of the quote's own yield with its convention, e.g. "swap rate (ann, 30/360)". */
  yieldLabel(q: Q): string;
  /** For a price quote, its own yield and back; null for a rate quote (the rate is its own yield). */
  priceYield(q: Q, settlement: IsoDate, label: string): QuoteYield | null;

  /**
   * The quote moved by d (decimal) in quote space: a rate quote by d in its own convention, a
   * price quote through its own yield and repriced; an error value when the moved price leaves
   * its range or no yield gives the price.
   */
  shift(q: Q, d: number, settlement: IsoDate): Result<Q>;

  /** How the smooth fit weighs the kind's price errors. */
  readonly fit: {
    /** Scale from the instrument's target to per 100 face (100 for a target of 1 of notional). */
    readonly per100: number;
    /** Dollar duration -dP/dy at the market's own yield, per unit of target. */
    dollarDuration(ins: Instrument, q: Q, settlement: IsoDate, marketYield: number): number;
    /** Whether the fit lists the kind's quotes as rich or cheap against the fitted curve (bonds). */
    readonly richCheap: boolean;
  };

  /**
   * The bootstrap's first guess of the first node: ln DF = -rate x t with this rate (decimal).
   * The solver's bounds are no kind's: every node is an ln DF within float64's range (solve.ts).
   */
  readonly solver: {
    firstRate(ins: Instrument): number;
  };

  /**
   * Optional: the fixed-leg convention a quote of the kind sets for forward par swap rates (the
   * forward grid's): a swap's own frequency, day count and end-of-month rule.
   */
  fixedLeg?(q: Q): FixedLegConvention;

  /**
   * Optional: true when the kind's reader makes its dates from its own fields (a future's contract
   * month, or start and end) and takes no tenor or maturity; it sets `maturity` (the node) itself,
   * after the valuation date.
   */
  readonly ownDates?: boolean;

  /** Optional: true when the kind takes the money-market tenors ON, TN and SN (deposits; time/depositDates.ts). */
  readonly moneyMarketTerms?: boolean;

  /**
   * Optional: true when a quote of the kind can set a turn's spread (`turns[i].solveFrom`;
   * bootstrap/turnSolve.ts): a money-market quote whose value the overnight rates over its period
   * set (deposit, FRA, future, OIS). Absent: a turn solved from it is refused naming the quote.
   */
  readonly turnSpread?: true;

  /**
   * Optional: how a quote of the kind builds a projection curve (a named curve of role
   * projection; bootstrap/namedCurveBuild.ts): `ratio` when its value is a ratio of that curve's
   * own discount factors (a deposit, a future; compiled as on one curve), `index-swap` when it is
   * a swap against the curve's index, discounted on the curve's discounting curve
   * (instruments/projectedSwap.ts), null for this quote not there. Absent: the kind is refused there.
   */
  onProjection?(q: Q): 'ratio' | 'index-swap' | null;

  /**
   * Optional: the quote's own dates after adjustment (the command's `start`, `end` and `payment`).
   * Without it: start at the valuation date, end at the maturity, no payment date.
   */
  dates?(q: Q, valuation: IsoDate): QuoteDates;
}

/** A quote's adjusted dates: its start, the end of its accrual, and (swaps) its last payment. */
export interface QuoteDates {
  readonly start: IsoDate;
  readonly end: IsoDate;
  /** The last payment date (swaps and overnight-index swaps); null for the other kinds. */
  readonly payment: IsoDate | null;
  /** The index's fixing date (an FRA's, two business days before its start); absent for the other kinds. */
  readonly fixing?: IsoDate;
}
