import { bootstrapInstruments } from '../bootstrap/bootstrap.ts';
import { compileMarket } from '../bootstrap/build.ts';
import type { Curve } from '../curve/curve.ts';
import type { Instrument } from '../instruments/instrument.ts';
import type { InterpolationId } from '../interpolation/types.ts';
import type { Compounding } from '../rates/compounding.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
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
}

export interface SensitivityMapBuild {
  readonly map: ForwardSensitivityMap;
  readonly curve: Curve;
  readonly instruments: readonly Instrument[];
}

/**
 * The forward-sensitivity map of a workspace: its enabled, valid quotes bootstrapped with the
 * chosen interpolation, forwards of `tenor` starting every `step`, each forward's sensitivity to
 * each quote in bp per bp (forwardSensitivities).
 */
export function sensitivityMapFor(ws: Workspace, options: SensitivityMapOptions = {}): Result<SensitivityMapBuild> {
  const market = compileMarket(ws.settlement, ws.curve.dayCount, ws.quotes, true);
  if (market.errors.length > 0) return { ok: false, errors: market.errors };
  if (market.instruments.length === 0) return fail(coreError('schema', 'quotes', 'no enabled, valid quote to build a curve from; add at least one quote'));
  const settings = {
    settlement: ws.settlement,
    dayCount: ws.curve.dayCount,
    interpolation: options.interpolation ?? ws.curve.interpolation,
    extrapolation: ws.curve.extrapolation,
  };
  const built = bootstrapInstruments(settings, market.instruments);
  if (!built.curve) return { ok: false, errors: built.errors };
  const c = options.compounding ?? 'simple';
  const dc = options.dayCount ?? ws.curve.dayCount;
  const rows = forwardRows(built.curve, options.tenor ?? { n: 3, unit: 'M' }, options.step ?? { n: 1, unit: 'Y' }, c, dc);
  if (!rows.ok) return rows;
  const map = forwardSensitivities(built.curve, market.instruments, rows.value, c, dc);
  if (!map.ok) return map;
  return ok({ map: map.value, curve: built.curve, instruments: market.instruments });
}
