import { workbenchBuildOptions } from './overnightKit.ts';
import { useEffect, useMemo, useRef, useState } from 'react';
import { CurveBuilder, INTERPOLATIONS, type InterpolationId } from '../core/index.ts';
import type { DisplaySettings } from '../core/index.ts';
import { forwardSeries, type SamplePoint } from './useCurveSeries.ts';

export interface MethodForwards {
  readonly method: InterpolationId;
  readonly points: readonly SamplePoint[];
  /** Why the method gave no curve on these quotes, when it did not. */
  readonly error: string | null;
}

type Idle = (cb: () => void) => () => void;
/** Runs work when the browser is idle (requestIdleCallback), or on the next task where it has none. */
export const whenIdle: Idle = (cb) => {
  const w = globalThis as typeof globalThis & { requestIdleCallback?: (cb: () => void, o?: { timeout: number }) => number; cancelIdleCallback?: (h: number) => void };
  if (w.requestIdleCallback && w.cancelIdleCallback) {
    const h = w.requestIdleCallback(cb, { timeout: 500 });
    return () => w.cancelIdleCallback!(h);
  }
  const h = setTimeout(cb, 0);
  return () => clearTimeout(h);
};

/**
 * Forwards of every interpolation method on the same quotes, built one method per idle slot so
 * the edit that triggered them paints first; results fill in progressively.
 */
export function useMethodOverlay(doc: Record<string, unknown> | null, displayAll: DisplaySettings, enabled: boolean): readonly MethodForwards[] {
  const [state, setState] = useState<{ key: unknown; rows: MethodForwards[] }>({ key: null, rows: [] });
  // One builder: the methods share the market (the interpolation does not enter it), so only the
  // first method's build compiles it, and a value edit re-quotes it.
  const builder = useRef<CurveBuilder | null>(null);
  // Only what the forwards depend on: an axis or checkbox change does not rebuild them.
  const { compounding, dayCount, forwardTenor } = displayAll;
  const display = useMemo(() => ({ ...displayAll, compounding, dayCount, forwardTenor }), [compounding, dayCount, forwardTenor]); // eslint-disable-line
  useEffect(() => {
    if (!enabled || !doc) return;
    let cancel: (() => void) | null = null;
    let k = 0;
    const rows: MethodForwards[] = [];
    const key = {};
    setState({ key, rows: [] });
    const step = (): void => {
      const method = INTERPOLATIONS[k++];
      if (!method) return;
      builder.current ??= new CurveBuilder();
      const b = builder.current.build(doc, { ...workbenchBuildOptions(), interpolation: method });
      if (b.curve) {
        rows.push({ method, points: forwardSeries(b.curve, display), error: null });
      } else rows.push({ method, points: [], error: b.errors[0]?.message ?? 'no curve' });
      setState({ key, rows: [...rows] });
      cancel = whenIdle(step);
    };
    cancel = whenIdle(step);
    return () => cancel?.();
  }, [doc, display, enabled]);
  return enabled ? state.rows : [];
}
