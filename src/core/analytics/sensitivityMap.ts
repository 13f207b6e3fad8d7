import { buildFromWorkspace } from '../bootstrap/build.ts';
import type { OvernightKit } from '../bootstrap/overnightKit.ts';
import type { Curve } from '../curve/curve.ts';
import type { Instrument } from '../instruments/instrument.ts';
import type { InterpolationId } from '../interpolation/types.ts';
import type { Compounding } from '../rates/compounding.ts';
import { ok, type Result } from '../result.ts';
import type { CurveDayCount } from '../time/dayCount.ts';
import type { Tenor } from '../time/tenor.ts';
import type { Workspace } from '../document/types.ts';
import { forwardRows, forwardSensitivities, type ForwardSensitivityMap } from './forwardSensitivity.ts';

export interface SensitivityMapOptions {
  /** Interpolation to build with (default the workspace's). */
  readonly interpolation?: InterpolationId;
  /** Forward tenor (default 3M). */
  readonly tenor?: Tenor;
  /** Step between forward starts (default 1Y). */
  readonly step?: Tenor;
  /** Compounding of the forwards (default simple). */
  readonly compounding?: Compounding;
  /** Day count of the forwards (default the curve's). */
  readonly dayCount?: CurveDayCount;
  /** The code of turns and meeting steps (OVERNIGHT_KIT), needed by a workspace that has them. */
  readonly overnight?: OvernightKit;
}

export interface SensitivityMapBuild {
  readonly map: ForwardSensitivityMap;
  readonly curve: Curve;
  readonly instruments: readonly Instrument[];
}

/**
 * The forward-sensitivity map of a workspace: its enabled, valid quotes built as the workbench
 * builds them (buildFromWorkspace, skipping invalid quotes, with the chosen interpolation and, given
 * `overnight`, the workspace's turns and meeting steps: the curve shown), forwards of `tenor`
 * starting every `step`, each forward's sensitivity to each quote in bp per bp
 * (forwardSensitivities, which reads the turns and solved spreads off the curve).
 */
export function sensitivityMapFor(ws: Workspace, options: SensitivityMapOptions = {}): Result<SensitivityMapBuild> {
  const built = buildFromWorkspace(ws, { skipInvalid: true, ...(options.interpolation ? { interpolation: options.interpolation } : {}), ...(options.overnight ? { overnight: options.overnight } : {}) });
  if (!built.curve) return { ok: false, errors: built.errors };
  const c = options.compounding ?? 'simple';
  const dc = options.dayCount ?? ws.curve.dayCount;
  const rows = forwardRows(built.curve, options.tenor ?? { n: 3, unit: 'M' }, options.step ?? { n: 1, unit: 'Y' }, c, dc);
  if (!rows.ok) return rows;
  const map = forwardSensitivities(built.curve, built.instruments, rows.value, c, dc);
  if (!map.ok) return map;
  return ok({ map: map.value, curve: built.curve, instruments: built.instruments });
}
