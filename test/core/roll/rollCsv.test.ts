// rollTablesCsv: the roll-versus-term tables as CSV read back to the analysis's own values
// (money exact as decimal text, rates to the last bit) with units and conventions in every header.
// The figures themselves are held to published examples in rollTextbook.test.ts; here the claim is
// that the file carries them unchanged.
import { describe, expect, it } from 'vitest';
import { analyseRollVsTerm, DEFAULT_STRATEGY, rollTablesCsv } from '../../../src/core/index.ts';
import { parseCsv } from '../../../src/core/index.ts';
import { rollMarketCurve } from '../../helpers/rollMarket.ts';

const r = analyseRollVsTerm(rollMarketCurve(), DEFAULT_STRATEGY);
if (!r.ok) throw new Error(JSON.stringify(r.errors));
const a = r.value;
const { rows, error } = parseCsv(rollTablesCsv(a, 'EUR'));

describe('rollTablesCsv(analysis, unit)', () => {
  it('parses as CSV and starts with the inputs', () => {
    expect(error).toBeNull();
    expect(rows[0]).toEqual(['roll versus term: inputs']);
    expect(rows[2]).toEqual([a.settlement, a.horizon, String(a.years), a.amount.toFixed(), a.rollTenor, a.rollDayCount, String(a.spotRollRate)]);
    expect(rows[1]![3]).toBe('amount (EUR)');
  });

  it('writes every view by every strategy with exact money and rates, and marks the best', () => {
    const start = rows.findIndex((row) => row[0] === 'strategies by views') + 2;
    expect(rows[start - 1]).toEqual(['view', 'strategy', 'terminal value (EUR, unrounded)', 'annualised return (decimal, ann, ACT/365F)', 'against rolling (EUR)', 'against rolling (bp a year, ann, ACT/365F)', 'best under this view']);
    let k = start;
    for (const v of a.views) {
      for (const s of v.strategies) {
        const row = rows[k++]!;
        expect(row[0]).toBe(v.label);
        expect(row[2]).toBe(s.terminal.toFixed());
        expect(Number(row[3])).toBe(s.annualReturn);
        expect(row[4]).toBe(s.vsRoll.toFixed());
        expect(Number(row[5])).toBe(s.vsRollBp);
        expect(row[6]).toBe(v.best === s.id ? 'yes' : '');
      }
    }
  });

  it('writes one row per roll leg with each view\'s leg rate', () => {
    const start = rows.findIndex((row) => row[0] === 'roll legs') + 2;
    expect(rows[start - 1]!.slice(0, 7)).toEqual(['leg', 'start', 'end', 'days', `year fraction (${a.rollDayCount})`, 'short leg', `today's forward (decimal, simple, ${a.rollDayCount})`]);
    expect(rows.length - start).toBe(a.legs.length);
    a.legs.forEach((leg, i) => {
      const row = rows[start + i]!;
      expect(row.slice(0, 4)).toEqual([String(leg.index), leg.start, leg.end, String(leg.days)]);
      expect(Number(row[6])).toBe(leg.forward);
      a.views.forEach((v, j) => expect(Number(row[7 + j])).toBe(v.legRates[i]));
    });
  });
});
