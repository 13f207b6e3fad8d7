import { toCsv, type CsvCell } from '../export/csv.ts';
import { rateTag, RETURN_TAG } from '../format/conventionTag.ts';
import type { RollAnalysis } from './rollVsTerm.ts';

/**
 * The roll-versus-term tables as CSV, in one file with three sections, each headed by a row
 * naming it and a row of column headers that carry units and conventions:
 * - the inputs (settlement, horizon, amount, roll tenor and day count);
 * - strategies by views: terminal value and differences against rolling in money, unrounded
 *   (exact decimal arithmetic, the workspace's currency), annualised return as a decimal
 *   (annual compounding, ACT/365F) and its difference against rolling in bp;
 * - the roll legs: dates, days, year fraction on the roll day count, today's forward and each
 *   view's leg rate as decimals (simple, roll day count).
 * `moneyUnit` is the currency code shown with money columns ("USD"), or a generic sign.
 */
export function rollTablesCsv(a: RollAnalysis, moneyUnit: string): string {
  const roll = rateTag('simple', a.rollDayCount);
  const rows: CsvCell[][] = [
    ['roll versus term: inputs'],
    ['settlement', 'horizon', `years to horizon (ACT/365F)`, `amount (${moneyUnit})`, 'roll tenor', 'roll day count', `today's roll spot rate (decimal, ${roll})`],
    [a.settlement, a.horizon, a.years, a.amount.toFixed(), a.rollTenor, a.rollDayCount, a.spotRollRate],
    [],
    ['strategies by views'],
    ['view', 'strategy', `terminal value (${moneyUnit}, unrounded)`, `annualised return (decimal, ${RETURN_TAG})`, `against rolling (${moneyUnit})`, `against rolling (bp a year, ${RETURN_TAG})`, 'best under this view'],
  ];
  const label = new Map(a.strategies.map((s) => [s.id, s.label]));
  for (const v of a.views) {
    for (const s of v.strategies) rows.push([v.label, label.get(s.id) ?? s.id, s.terminal.toFixed(), s.annualReturn, s.vsRoll.toFixed(), s.vsRollBp, v.best === s.id ? 'yes' : '']);
  }
  rows.push([], ['roll legs'], ['leg', 'start', 'end', 'days', `year fraction (${a.rollDayCount})`, 'short leg', `today's forward (decimal, ${roll})`, ...a.views.map((v) => `${v.label} (decimal, ${roll})`)]);
  a.legs.forEach((leg, i) => rows.push([leg.index, leg.start, leg.end, leg.days, leg.tau, leg.short ? 'yes' : '', leg.forward, ...a.views.map((v) => v.legRates[i] ?? null)]));
  return toCsv(rows);
}
