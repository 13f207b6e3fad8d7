import { compileMarket, type CurveBuild, type Instrument } from '../core/index.ts';

/**
 * The instruments behind a successful build, compiled by the engine (compileMarket) from the
 * build's own validated workspace, with duplicates dropped as buildCurve drops them; null when
 * they do not match the curve's pillars one for one (then no fast rebuild is attempted).
 */
export function compiledInstruments(build: CurveBuild): readonly Instrument[] | null {
  const ws = build.workspace;
  const curve = build.curve;
  if (!ws || !curve) return null;
  const market = compileMarket(ws.settlement, ws.curve.dayCount, ws.quotes, true);
  if (market.errors.length > 0 || market.instruments.length !== curve.pillars.length) return null;
  if (market.instruments.some((ins, i) => ins.index !== curve.pillars[i]!.quote)) return null;
  return market.instruments;
}
