/**
 * Policy-meeting steps: the overnight curve takes a node on each policy effective date (the day the
 * new rate applies) with log-linear discount factors, so flat overnight forwards, between nodes:
 * one forward level per meeting period (Ametrano, Bertocchi & Mazzocchi, "Advanced EONIA curve
 * calibration", SSRN 2881445: piecewise-flat overnight forwards between effective dates).
 *
 * The rule, exactly. Let M_1 < ... < M_m be the effective dates and P the quotes' pillars (sorted).
 * Every effective date must lie after the valuation date and on or before the last pillar (else an
 * error naming the date). The nodes are M_1..M_m, then the pillars after M_m. The periods
 * (valuation, M_1], (M_1, M_2], ..., (M_(m-1), M_m] must each hold exactly one pillar: that quote
 * solves the period's flat level (the node at the period's end; its flows all lie before it, on
 * the flat segment). A period with no pillar is an error naming its dates and the quotes either
 * side; two pillars in one period an error naming both quotes. Each pillar after M_m is its own
 * node, as in an ordinary log-linear-discount bootstrap. A step curve is therefore always built
 * log-linear in discount factors, whatever the curve's method.
 */
import type { Instrument } from '../instruments/instrument.ts';
import { coreError, type CoreError } from '../result.ts';
import type { IsoDate } from '../time/date.ts';

/** An effective date on the curve's axis. */
export interface MeetingNode {
  readonly date: IsoDate;
  readonly t: number;
  /** Index in the document's `meetingSteps.effectiveDates`. */
  readonly index: number;
}

/** Node k (1-based, per instrument in pillar order): its time and date. */
export interface StepNodes {
  readonly times: number[];
  readonly dates: IsoDate[];
}

const named = (ins: Instrument): string => `quotes[${ins.index}] (${ins.kind} ${ins.maturity})`;

/**
 * The node of each instrument (sorted by pillar time) under meeting steps, or the errors of the rule
 * above. `settlement` names the first period's start.
 */
export function stepNodes(instruments: readonly Instrument[], meetings: readonly MeetingNode[], settlement: IsoDate): StepNodes | CoreError[] {
  const errors: CoreError[] = [];
  const last = instruments[instruments.length - 1]!;
  for (const m of meetings) {
    const path = `meetingSteps.effectiveDates[${m.index}]`;
    if (m.t <= 0) errors.push(coreError('before-settlement', path, `effective date ${m.date} (${path}) is on or before the valuation date ${settlement}, outside the curve; remove it or move the valuation date`));
    else if (m.t > last.t) errors.push(coreError('beyond-curve', path, `effective date ${m.date} (${path}) is after the curve's last pillar ${last.maturity}, outside the curve; remove it or add a quote maturing after it`));
  }
  if (errors.length > 0) return errors;
  const times: number[] = [];
  const dates: IsoDate[] = [];
  let k = 0;
  let prevDate = settlement;
  for (const m of meetings) {
    const inside: Instrument[] = [];
    while (k < instruments.length && instruments[k]!.t <= m.t) inside.push(instruments[k++]!);
    if (inside.length === 0) {
      const before = k > 0 ? ` (${named(instruments[k - 1]!)} ends before it` : ' (';
      const after = k < instruments.length ? `${k > 0 ? ', ' : ''}${named(instruments[k]!)} after it)` : ')';
      errors.push(
        coreError(
          'empty-period',
          `meetingSteps.effectiveDates[${m.index}]`,
          `no quote ends in the meeting period from ${prevDate} to ${m.date}${before}${after}: each period between effective dates needs one quote whose last date falls in it; add one (a deposit, an OIS or a dated swap over the period), or remove the effective date ${m.date}`,
        ),
      );
    } else if (inside.length > 1) {
      errors.push(
        coreError(
          'duplicate-pillar',
          `quotes[${inside[1]!.index}]`,
          `${inside.map(named).join(' and ')} ${inside.length === 2 ? 'both' : 'all'} end in the meeting period from ${prevDate} to ${m.date}: with meeting steps each period between effective dates takes one quote; switch all but one off, or turn the steps off`,
          inside[1]!.index,
        ),
      );
    } else {
      times.push(m.t);
      dates.push(m.date);
    }
    prevDate = m.date;
  }
  for (; k < instruments.length; k++) {
    times.push(instruments[k]!.t);
    dates.push(instruments[k]!.maturity);
  }
  return errors.length > 0 ? errors : { times, dates };
}
