// The small roll-versus-term test market: deposits and swaps settling 2026-12-01 at rates of our
// own invention (test and demo data, not market data). Shared by the roll analysis tests, the
// roll panel's component test and the roll panel's browser harness page (bundled by vite, so
// nothing here may need Node or vitest).
import { buildCurve, type Curve } from '../../src/core/index.ts';
import { type Quote, workspaceDoc, type WorkspaceDoc } from './markets.ts';

export const ROLL_MARKET_SETTLEMENT = '2026-12-01';

/** The invented quotes, shortest first. */
export const ROLL_MARKET_QUOTES: readonly Quote[] = [
  { kind: 'deposit', tenor: '1M', rate: 0.031 },
  { kind: 'deposit', tenor: '3M', rate: 0.032 },
  { kind: 'deposit', tenor: '6M', rate: 0.0335 },
  { kind: 'swap', tenor: '1Y', rate: 0.034 },
  { kind: 'swap', tenor: '2Y', rate: 0.036 },
  { kind: 'swap', tenor: '3Y', rate: 0.0375 },
  { kind: 'swap', tenor: '5Y', rate: 0.039 },
  { kind: 'swap', tenor: '10Y', rate: 0.042 },
];

/**
 * The workspace document of the invented roll market (ACT/365F, monotone-convex, no
 * extrapolation): every quote, or only the quotes at the tenors given, kept in market order.
 */
export function rollMarketDoc(tenors?: readonly string[]): WorkspaceDoc {
  const unknown = tenors?.filter((t) => !ROLL_MARKET_QUOTES.some((q) => q.tenor === t)) ?? [];
  if (unknown.length > 0) throw new Error(`rollMarketDoc: no invented roll quote at ${unknown.join(', ')}`);
  const quotes = tenors ? ROLL_MARKET_QUOTES.filter((q) => tenors.includes(String(q.tenor))) : ROLL_MARKET_QUOTES;
  return workspaceDoc(quotes, { settlement: ROLL_MARKET_SETTLEMENT, dayCount: 'ACT/365F', interpolation: 'monotone-convex', extrapolation: 'none' });
}

/** Today's curve built from rollMarketDoc(tenors); throws with the engine's messages if the build fails. */
export function rollMarketCurve(tenors?: readonly string[]): Curve {
  const build = buildCurve(rollMarketDoc(tenors));
  if (!build.curve) throw new Error(`rollMarketCurve: ${build.errors.map((e) => e.message).join('; ')}`);
  return build.curve;
}
