import { useEffect, useMemo, useReducer, useState } from 'react';
import { DEFAULT_CURVE_NAME, type WorkbenchCurves } from '../core/index.ts';
import { useAppStore } from '../state/store.ts';
import type { WorkbenchBuild } from './useCurveBuild.ts';
import type { NamedCurvesKit } from '../features/namedCurves/namedCurvesKit.ts';

/**
 * A workspace's named curves (the document's `curves`): their reader, build, picker and spread
 * view are fetched on first use (features/namedCurves/namedCurvesKit.ts, in the `later` chunk), so
 * a workspace of one curve never loads them and its first screen is as before.
 */
let kit: NamedCurvesKit | null = null;
let pending: Promise<NamedCurvesKit> | null = null;

function loadKit(): Promise<NamedCurvesKit> {
  pending ??= import('../features/namedCurves/namedCurvesKit.ts').then(
    (m) => (kit = m.NAMED_CURVES_KIT),
    (error: unknown) => {
      pending = null; // a later render tries again
      throw error;
    },
  );
  return pending;
}

export interface NamedCurvesView {
  /** The build the charts and tables show: the default build, or the chosen named curve's. */
  readonly shown: WorkbenchBuild;
  /** The loaded code, null for a workspace of one curve (or while it loads). */
  readonly kit: NamedCurvesKit | null;
  /** The named curves read and built (derived from the document, never stored), null as `kit`. */
  readonly named: WorkbenchCurves | null;
  /** True while the form adding a first named curve is open (the code is fetched for it). */
  readonly adding: boolean;
  /** Opens (true) or closes the form adding a named curve to a workspace of one curve. */
  readonly setAdding: (open: boolean) => void;
  /** True when the workspace has named curves (or one is being added). */
  readonly needed: boolean;
}

/** The named curves of the workspace, built after the default build `result`, and the build to show. */
export function useNamedCurves(result: WorkbenchBuild): NamedCurvesView {
  const curves = useAppStore((s) => s.workspace.curves);
  const settlement = useAppStore((s) => s.workspace.settlement);
  const calendars = useAppStore((s) => s.workspace.calendars);
  const customCalendars = useAppStore((s) => s.workspace.customCalendars);
  const view = useAppStore((s) => s.workspace.view);
  const [adding, setAdding] = useState(false);
  const needed = curves !== undefined || adding;
  const [, arrived] = useReducer((n: number) => n + 1, 0);
  useEffect(() => {
    if (!needed || kit !== null) return;
    let live = true;
    loadKit().then(
      () => live && arrived(),
      () => undefined,
    );
    return () => {
      live = false;
    };
  }, [needed]);
  const loaded = needed ? kit : null;
  const defaultCurve = result.build.curve;
  const named = useMemo(() => (loaded ? loaded.buildWorkbenchCurves({ settlement, calendars, customCalendars, curves }, defaultCurve) : null), [loaded, settlement, calendars, customCalendars, curves, defaultCurve]);
  const shown = useMemo(() => {
    if (!loaded || !named) return result;
    const s = loaded.shownBuild(result, named, { settlement, calendars, customCalendars, curves }, view);
    const ws = result.build.workspace;
    const defaultCurve = result.build.curve;
    // A named curve shown: what its scenarios move is the whole document (the curves built on it move with it).
    const read = named.read;
    if (s === result || !ws || !defaultCurve || !read || !s.curveName) return s;
    const name = s.curveName;
    const whole = { ...ws, curves: read };
    return { ...s, onCurves: { move: (sc, options, path) => loaded.applyScenarioOnCurve(sc, whole, defaultCurve, named.curves, name, options, path), built: named.curves } };
  }, [loaded, named, result, settlement, calendars, customCalendars, curves, view]);
  return { shown, kit: loaded, named, adding, setAdding, needed };
}

/**
 * For captions saying which curve a panel reads: ` on the curve "name"` (by default the sheet's
 * curve, which the document calls "default") when the workspace has named curves, else undefined
 * (a workspace of one curve reads as before).
 */
export function useOnCurve(name = DEFAULT_CURVE_NAME): string | undefined {
  return useAppStore((s) => s.workspace.curves !== undefined) ? ` on the curve "${name}"` : undefined;
}
