import { describe, expect, it } from 'vitest';
import { buildCurve, explainSolvedTurn, INTERPOLATIONS, OVERNIGHT_KIT, topInfluencesOfSolvedTurn, turnSpreads, type CurveBuild } from '../../../src/core/index.ts';
import { INVENTED_2022_SOLVED_TURN } from '../../helpers/markets.ts';

// The explanation of a turn's spread solved from the quote that spans it (curve/explainTurn.ts).
// Claims:
// 1. it ends in the Overnight section's figure (turnSpreads) bit for bit, from the solver's own
//    record (nothing solved again), under every method;
// 2. each spread tried and its g are recomputed here independently: the document without the
//    spanning quote, the turn typed at that spread (spreadBp = s x 10,000), built, and the
//    spanning quote priced on that curve by its own instrument (the turn model of
//    MARKET-CONVENTIONS.md section h: estimate the spread from an instrument spanning the turn);
// 3. at the spread taken the quote reprices within the engine's 1e-14 in rate;
// 4. the quotes it depends on most (the implicit-function rule) against bump-and-rebuild of the document.
// The market is invented (test/helpers/markets.ts).

const build = (d: unknown): CurveBuild => buildCurve(d, { overnight: OVERNIGHT_KIT });
const doc = (interpolation: string) => ({ ...INVENTED_2022_SOLVED_TURN, curve: { ...INVENTED_2022_SOLVED_TURN.curve, interpolation } });

describe('explainSolvedTurn', () => {
  it.each(INTERPOLATIONS)('ends in the table figure; every spread tried gives its g again from a typed spread (%s)', (method) => {
    const b = build(doc(method));
    expect(b.errors).toEqual([]);
    const figure = turnSpreads(b).find((x) => x.index === 0)!.spreadBp;
    const r = explainSolvedTurn(b, 0);
    if (!r.ok) throw new Error(r.errors[0]!.message);
    const e = r.value;
    expect(Object.is(e.value, figure)).toBe(true);
    expect(Object.is(e.steps.at(-1)!.value, figure)).toBe(true);
    expect(e.quantity).toBe('turn-spread');
    const market = e.steps.find((s) => s.name === 'market')!.value;
    const spanning = INVENTED_2022_SOLVED_TURN.quotes[3]!;
    expect(market).toBe(spanning.rate);
    // Each trial again: the other quotes and the turn typed at s_k, then the spanning quote's model minus market.
    const others = { ...doc(method), quotes: INVENTED_2022_SOLVED_TURN.quotes.filter((_, i) => i !== 3) };
    const insOf = b.instruments.find((i) => i.index === 3)!;
    const trials = e.steps.filter((s) => /^s\d+$/.test(s.name));
    expect(trials.length).toBeGreaterThan(1);
    for (const s of trials) {
      const g = e.steps.find((x) => x.name === `g${s.name.slice(1)}`)!.value;
      const typed = build({ ...others, turns: [{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', spreadBp: s.value * 1e4 }] });
      expect(typed.errors).toEqual([]);
      const again = insOf.modelQuote(typed.curve!.lnDiscountAt) - market;
      // The typed spread passes through bp (x 1e4 / 1e4): a few ulps of s, so g to 1e-15 absolute in rate.
      expect(Math.abs(again - g), `${method}: ${s.name}`).toBeLessThanOrEqual(1e-15);
    }
    // At the spread taken the quote reprices (the engine's tolerance), and the last step is s x 10,000.
    expect(Math.abs(e.steps.find((x) => x.name === 'g')!.value)).toBeLessThanOrEqual(1e-14);
    const s = e.steps.find((x) => x.name === 's')!.value;
    expect(e.value).toBe(s * 1e4);
  });

  it('says so for a turn the user set', () => {
    const b = build({ ...INVENTED_2022_SOLVED_TURN, turns: [{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', spreadBp: 10 }] });
    const r = explainSolvedTurn(b, 0);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0]!.message).toBe('this turn has no spread solved from a quote on the curve now');
  });

  it.each(['log-linear-discount', 'monotone-convex'] as const)('its quotes, in bp of spread per bp of quote, match bump-and-rebuild of the document (%s)', (method) => {
    const b = build(doc(method));
    const top = topInfluencesOfSolvedTurn(b.curve!, b.instruments, 0);
    if (!top.ok) throw new Error(top.errors[0]!.message);
    expect(top.value.length).toBe(5);
    // The spanning quote moves it most: its period holds the turn's days.
    expect(top.value[0]!.index).toBe(3);
    const h = 1e-6;
    for (const q of top.value) {
      const moved = (d: number) => {
        const quotes = INVENTED_2022_SOLVED_TURN.quotes.map((x, i) => (i === q.index ? { ...x, rate: x.rate + d } : x));
        return build({ ...doc(method), quotes }).overnight!.turns[0]!.spread;
      };
      const bumped = (moved(h) - moved(-h)) / (2 * h);
      expect(Math.abs(bumped - q.bpPerBp), `${method}: quotes[${q.index}]`).toBeLessThanOrEqual(1e-5 * Math.max(1, Math.abs(q.bpPerBp)));
    }
  });
});
