import type { DayCount } from '../time/dayCount.ts';
import { rateTag, RETURN_TAG } from '../format/conventionTag.ts';
import { formatAmount, formatBpChange, formatRate, formatRateShort } from '../format/quantities.ts';
import type { RollBreakEvens } from './rollBreakEven.ts';
import { MONEY_UNIT, type Money } from './strategyMoney.ts';
import type { StrategyId, TermStrategyId } from './strategyValues.ts';
import type { StrategyDescription, ViewOutcome } from './rollVsTerm.ts';

/**
 * Text for the roll-versus-term panel and the printed summary: every rate with its compounding and
 * day count, money with its unit. Pure formatting of values the analysis computed.
 */

/** The unit shown with money: the strategy's ISO 4217 currency code, or the generic sign MONEY_UNIT when it names none. */
export const moneyUnitOf = (currency: string): string => (currency === '' ? MONEY_UNIT : currency);

export interface SummaryInput {
  readonly view: ViewOutcome;
  readonly strategies: readonly StrategyDescription[];
  readonly breakEvens: RollBreakEvens;
  readonly horizon: string;
  readonly rollTenor: string;
  readonly rollDayCount: DayCount;
  readonly legCount: number;
  /** The unit shown with money (moneyUnitOf the strategy's currency); the generic sign by default. */
  readonly moneyUnit?: string;
}

/**
 * The result sentence: which strategy ends ahead under the chosen view and by how much (money and
 * bp a year, annual ACT/365F), and the break-even roll rate (simple on the roll day count) against
 * the strategy it is compared with.
 */
export function rollSentence(input: SummaryInput): string {
  const { view, strategies, breakEvens } = input;
  const amount = (m: Money): string => formatAmount(m, input.moneyUnit ?? MONEY_UNIT);
  const label = (id: StrategyId): string => strategies.find((s) => s.id === id)?.phrase ?? id;
  const outcome = (id: StrategyId) => view.strategies.find((s) => s.id === id)!;
  const roll = outcome('roll');
  const spread = Math.max(...view.strategies.map((s) => s.growth)) - Math.min(...view.strategies.map((s) => s.growth));
  const rTag = rateTag('simple', input.rollDayCount);
  const legsText = input.legCount > 2 ? `legs 2 to ${input.legCount}` : input.legCount === 2 ? 'leg 2' : null;
  const rStar = (id: TermStrategyId): string => {
    const r = breakEvens.rollRate[id];
    if (legsText === null) return `With a single roll leg the roll is fixed today at its spot rate; there is no break-even roll rate.`;
    return r === null
      ? `No constant roll rate between ${formatRateShort(-0.5)} and ${formatRateShort(1.5)} makes rolling match ${label(id)}.`
      : `Rolling matches ${label(id)} if ${legsText} earn ${formatRate(r, rTag)}.`;
  };
  if (spread <= 1e-12) {
    return `Under ${view.phrase} every strategy ends at ${amount(roll.terminal)} on ${input.horizon}: this is the baseline, what today's forwards imply. ${rStar('zero')}`;
  }
  if (view.best === 'roll') {
    let rival: TermStrategyId = 'zero';
    for (const id of ['bond', 'riding'] as const) if (outcome(id).growth > outcome(rival).growth) rival = id;
    const r = outcome(rival);
    return (
      `Under ${view.phrase}, ${label('roll')} ends ahead at ${amount(roll.terminal)} on ${input.horizon}, ` +
      `${amount(r.vsRoll.negated())} (${formatBpChange(-r.vsRollBp)} a year, ${RETURN_TAG}) more than ${label(rival)}. ${rStar(rival)}`
    );
  }
  const best = outcome(view.best);
  return (
    `Under ${view.phrase}, ${label(view.best)} ends ahead at ${amount(best.terminal)} on ${input.horizon}, ` +
    `${amount(best.vsRoll)} (${formatBpChange(best.vsRollBp)} a year, ${RETURN_TAG}) more than ${label('roll')}. ${rStar(view.best as TermStrategyId)}`
  );
}
