/**
 * Turns (year end, quarter end) on the overnight curve: an extra overnight spread s over the d
 * calendar days of a turn multiplies every later discount factor by J = exp(-s d / 360),
 *
 *   DF(t) = DF_smooth(t) x prod_j exp(-s_j d_j(t) / 360),
 *
 * where d_j(t) is the number of days of turn j's range before t (ACT/360 on the overnight rate),
 * so every forward period that contains a turn day rises by its share of the spread and no other
 * moves. This is the jump model of Ametrano & Bianchetti, "Everything you always wanted to know
 * about multiple interest rate curve bootstrapping but were afraid to ask" (2013), section 4.8
 * (DF = DF_smooth x jumps after the turn date); spreading the jump over the turn's days is this
 * engine's choice, so the one-day forward on each turn day is the smooth one plus s.
 *
 * In the bootstrap the instruments see the turned curve and the smooth curve is what the
 * interpolation carries: each instrument is wrapped (`TurnedInstrument`) so that its flows are
 * valued at ln DF_smooth + ln J, and the built curve is the smooth one with the jumps put back
 * (`turnedCurve` in bootstrap.ts). Days between two times are read on the curve's own clock: within a turn
 * d_j(t) = D_j (t - a_j) / (b_j - a_j), exact for the ACT day counts (linear in days).
 */
import type { Instrument } from '../instruments/instrument.ts';
import type { Quote, Turn } from '../document/types.ts';
import { coreError, type CoreError } from '../result.ts';
import { kindModule } from '../kinds/registry.ts';
import type { CalendarOutcome } from '../time/calendars.ts';
import type { IsoDate } from '../time/date.ts';
import { turnDays, type CalendarLimits } from '../time/turnDays.ts';

/** The workspace's calendars as the build reads them: a calendar by id (with the workspace's edits), and the calendar module's limits. */
export interface TurnCalendars extends CalendarLimits {
  readonly calendarOf: (id: string) => CalendarOutcome;
}

/** A turn placed on the curve's axis. */
export interface TurnSpan {
  /** Index in the document's `turns`. */
  readonly index: number;
  readonly name: string;
  /** First calendar day carrying the spread, and the day after the last (exclusive). */
  readonly start: IsoDate;
  readonly end: IsoDate;
  /** Calendar days covered (end - start). */
  readonly days: number;
  /** The spread, decimal (bp / 1e4), simple ACT/360 on the overnight rate. */
  readonly spread: number;
  /** Curve times of start and end. */
  readonly a: number;
  readonly b: number;
  /** ln of the full jump, -spread x days / 360. */
  readonly lnJump: number;
  /** The quote (its index) that sets the spread (bootstrap/turnSolve.ts); undefined when the user set it. */
  readonly solveFrom?: number | null | undefined;
  /** On a built curve, how a solved spread was found (turnSolve.ts); absent for a spread the user set. */
  readonly solve?: TurnSolveRecord;
}

/**
 * How turnSolve.ts found a turn's spread: the spanning quote (its index; its market value is the instrument's), each spread tried
 * (decimal, simple ACT/360) with g = the quote's model value minus its market value on the curve
 * bootstrapped from the other quotes with the turn at that spread (in the quote's unit: a rate as
 * a decimal, a price per 100), in the order tried in the last round that solved it; and g on the
 * final curve, every turn at its spread.
 */
export interface TurnSolveRecord {
  readonly quote: number;
  readonly trials: readonly { readonly spread: number; readonly gap: number }[];
  readonly gap: number;
}

/** The span with another spread (decimal): the jump follows. */
export function withSpread(span: TurnSpan, spread: number): TurnSpan {
  return { ...span, spread, lnJump: (-spread * span.days) / 360 };
}

/** The calendar a turn's business days are read on: its own, else the first enabled quote's, else weekends. */
function turnCalendarId(turn: Turn, quotes: readonly Quote[]): string {
  if (turn.calendar !== undefined) return turn.calendar;
  for (const q of quotes) {
    const c = (q as { readonly calendar?: unknown }).calendar;
    if (q.enabled && typeof c === 'string') return c;
  }
  return 'weekends';
}

/**
 * Places the document's turns on the curve's axis. Errors name the turn: an unknown calendar, a
 * range with no business day, a range starting before the valuation date.
 */
export function resolveTurns(
  turns: readonly Turn[],
  settlement: IsoDate,
  time: (date: IsoDate) => number,
  quotes: readonly Quote[],
  calendars: TurnCalendars,
): { spans: TurnSpan[]; errors: CoreError[] } {
  const spans: TurnSpan[] = [];
  const errors: CoreError[] = [];
  turns.forEach((turn, index) => {
    const path = `turns[${index}]`;
    const id = turnCalendarId(turn, quotes);
    const cal = calendars.calendarOf(id);
    if (!cal.ok) {
      errors.push(coreError('unknown-identifier', `${path}.calendar`, `turn "${turn.name}" (${path}): ${cal.message}`));
      return;
    }
    const days = turnDays(turn.from, turn.to, cal.calendar, calendars);
    if (typeof days === 'string') {
      errors.push(coreError('empty-period', `${path}.from`, `turn "${turn.name}" (${path}, ${turn.from} to ${turn.to}): ${days}`));
      return;
    }
    if (days.start < settlement) {
      // ISO dates compare as text (compareIso).
      errors.push(coreError('before-settlement', `${path}.from`, `turn "${turn.name}" (${path}) starts on ${days.start}, before the valuation date ${settlement}; move it on or after ${settlement} or remove it`));
      return;
    }
    const q = turn.solveFrom;
    if (q !== undefined) {
      // It must be a quote of the market (read without error, switched on) of a kind that can carry a turn.
      const quote = quotes.find((x) => x.index === q);
      const why = !quote ? 'no quote of the curve (past the list, left out, or a row empty or removed)' : !quote.enabled ? 'switched off' : kindModule(quote.kind).turnSpread ? null : `a ${quote.kind}, which cannot carry a turn (a deposit, FRA, future or OIS can)`;
      if (why) {
        errors.push(coreError('no-solution', `${path}.solveFrom`, `turn "${turn.name}" (${path}) is solved from quotes[${q}], ${why}; pick a quote over the turn, or give its spread in bp`));
        return;
      }
    }
    const a = time(days.start);
    const b = time(days.end);
    // A solved turn starts at 0 bp; turnSolve.ts sets it.
    const spread = q === undefined ? turn.spreadBp! / 1e4 : 0;
    spans.push({ index, name: turn.name, start: days.start, end: days.end, days: days.days, spread, a, b, lnJump: (-spread * days.days) / 360, solveFrom: q });
  });
  // Overlapping turns add their spreads; nothing to refuse.
  return { spans, errors };
}

/** ln J(t) = -sum_j s_j d_j(t) / 360: the turns' share of ln DF at time t (0 before every turn). */
export function turnLn(spans: readonly TurnSpan[], t: number): number {
  let ln = 0;
  for (const s of spans) {
    if (t <= s.a) continue;
    ln += t >= s.b ? s.lnJump : (s.lnJump * (t - s.a)) / (s.b - s.a);
  }
  return ln;
}

/** -d ln J / dt: the turns' share of the instantaneous forward at t (continuous, on the curve's day count). */
export function turnForward(spans: readonly TurnSpan[], t: number): number {
  let f = 0;
  for (const s of spans) if (t >= s.a && t < s.b) f -= s.lnJump / (s.b - s.a);
  return f;
}

/** The turns that reach past the curve's last pillar time, as errors naming each. */
export function turnsBeyond(spans: readonly TurnSpan[], lastT: number, lastDate: IsoDate): CoreError[] {
  return spans
    .filter((s) => s.b > lastT)
    .map((s) =>
      coreError('beyond-curve', `turns[${s.index}].to`, `turn "${s.name}" (turns[${s.index}]) runs to ${s.end}, past the curve's last pillar ${lastDate}; end it by ${lastDate}, add a quote maturing after ${s.end}, or remove the turn`),
    );
}

/**
 * An instrument seen through the turns: its flows valued at ln DF_smooth + ln J. Its amounts carry
 * J (so sum_j amounts_j DF_smooth(t_j) is the turned present value), a closed form is moved to the
 * smooth node, and every formula that reads ln DF and DF at its flows reads the turned values.
 */
export class TurnedInstrument implements Instrument {
  readonly quote: Quote;
  readonly index: number;
  readonly kind: Quote['kind'];
  readonly maturity: IsoDate;
  readonly t: number;
  readonly unit: Instrument['unit'];
  readonly field: string;
  readonly market: number;
  readonly times: readonly number[];
  readonly amounts: number[];
  readonly target: number;
  readonly curves: Instrument['curves'];
  readonly closedFormLn: number | null;
  // Declared only: present exactly when the wrapped instrument has them (callers test `!== undefined`).
  declare readonly targetFromFlows?: NonNullable<Instrument['targetFromFlows']>;
  declare readonly targetSlopes?: NonNullable<Instrument['targetSlopes']>;
  declare readonly residualFromFlows?: NonNullable<Instrument['residualFromFlows']>;

  constructor(
    readonly inner: Instrument,
    private readonly lnJ: readonly number[],
  ) {
    this.quote = inner.quote;
    this.index = inner.index;
    this.kind = inner.kind;
    this.maturity = inner.maturity;
    this.t = inner.t;
    this.unit = inner.unit;
    this.field = inner.field;
    this.market = inner.market;
    this.times = inner.times;
    this.target = inner.target;
    this.curves = inner.curves;
    const n = inner.times.length;
    this.amounts = new Array<number>(n);
    for (let j = 0; j < n; j++) this.amounts[j] = inner.amounts[j]! * Math.exp(lnJ[j]!);
    this.closedFormLn = inner.closedFormLn === null ? null : inner.closedFormLn - lnJ[n - 1]!;
    const { targetFromFlows, targetSlopes, residualFromFlows } = inner;
    if (targetFromFlows) this.targetFromFlows = (ln, df, o) => this.turned(ln, o, (l, d) => targetFromFlows.call(inner, l, d, 0));
    if (targetSlopes) this.targetSlopes = (ln, df, o, out) => this.turned(ln, o, (l, d) => targetSlopes.call(inner, l, d, 0, out));
    if (residualFromFlows) this.residualFromFlows = (ln, df, o) => this.turned(ln, o, (l, d) => residualFromFlows.call(inner, l, d, 0));
  }

  /** Calls `f` on the turned ln DF and DF at this instrument's flows, from smooth ln DF at `ln[offset..]`. */
  private turned<T>(ln: ArrayLike<number>, offset: number, f: (ln: number[], df: number[]) => T): T {
    const n = this.times.length;
    const l = new Array<number>(n);
    const d = new Array<number>(n);
    for (let j = 0; j < n; j++) {
      l[j] = ln[offset + j]! + this.lnJ[j]!;
      d[j] = Math.exp(l[j]!);
    }
    return f(l, d);
  }

  quoteFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number): number {
    return this.turned(ln, offset, (l, d) => this.inner.quoteFromFlows(l, d, 0));
  }

  modelQuote(lnDiscountAt: (t: number) => number): number {
    // lnDiscountAt is the smooth curve here, as everywhere inside the bootstrap.
    const n = this.times.length;
    const ln = new Array<number>(n);
    for (let j = 0; j < n; j++) ln[j] = lnDiscountAt(this.times[j]!);
    return this.quoteFromFlows(ln, ln, 0);
  }

  requote(value: number): Instrument {
    return new TurnedInstrument(this.inner.requote(value), this.lnJ);
  }
}

/** The instruments seen through the turns (the very array when there are none). */
export function withTurns(instruments: readonly Instrument[], spans: readonly TurnSpan[]): readonly Instrument[] {
  if (spans.length === 0) return instruments;
  return instruments.map((ins) => new TurnedInstrument(ins, ins.times.map((t) => turnLn(spans, t))));
}
