import type { CurveBuild, Instrument } from '../core/index.ts';

/**
 * The instruments behind a successful build, as the engine compiled them for it (buildCurve's
 * `instruments`, one per pillar); null when they do not match the curve's pillars one for one
 * (then no fast rebuild is attempted).
 */
export function compiledInstruments(build: CurveBuild): readonly Instrument[] | null {
  const curve = build.curve;
  if (!build.workspace || !curve) return null;
  const instruments = build.instruments;
  if (instruments.length !== curve.pillars.length) return null;
  if (instruments.some((ins, i) => ins.index !== curve.pillars[i]!.quote)) return null;
  return instruments;
}
