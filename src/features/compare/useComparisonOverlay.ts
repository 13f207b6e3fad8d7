import { useMemo } from 'react';
import {
  FIT_MODEL_LABEL,
  rateTag,
  forwardSamples,
  marketDate,
  parseTenor,
  rebuildSnapshot,
  referenceForwardSamples,
  referenceZeroSamples,
  samplesByDate,
  validateSnapshots,
  zeroSamples,
  type Curve,
  type DisplaySettings,
  type Samples,
} from '../../core/index.ts';
import type { ChartLine } from '../../charts/RateChart.tsx';
import { FIT_STYLE, REFERENCE_STYLE, SNAPSHOT_OVERLAY_MAX, SNAPSHOT_STYLES } from '../../charts/palette.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useLazyReference } from './useLazyReference.ts';
import { chartEndDate, points as samplePoints, sampleGridFor, type SamplePoint } from '../../hooks/useCurveSeries.ts';
import { useAppStore } from '../../state/store.ts';
import { comparisonChoice } from './comparisonChoice.ts';
import { datedAt } from '../curves/datedAt.ts';
import { useFitInput } from './fitInput.ts';
import { useLazyFit } from './useLazyFit.ts';
import { useReferenceInput } from './referenceInput.ts';

export interface ComparisonOverlay {
  readonly zero: ChartLine[];
  readonly forward: ChartLine[];
  /** Sentences for the legends: what was not drawn and why. */
  readonly notes: string[];
  /** How each drawn comparison is read, per chart: another settlement's lining up, the reference's reading. */
  readonly how: { readonly zero: string[]; readonly forward: string[] };
}

const EMPTY: ComparisonOverlay = { zero: [], forward: [], notes: [], how: { zero: [], forward: [] } };

/** Zero and forward samples of a curve on its own grid, in the display convention (as the base curve is sampled). */
function sampled(c: Curve, display: DisplaySettings): { zero: Samples; forward: Samples } {
  const grid = sampleGridFor(c, display);
  return { zero: zeroSamples(c, grid, display.compounding), forward: forwardSamples(c, grid, display.compounding) };
}

/**
 * The comparisons chosen in the document's view, as lines for the zero and forward charts: the
 * chosen snapshots (rebuilt from their inputs; at most SNAPSHOT_OVERLAY_MAX), the imported
 * reference curve (zero rates at its dates; forwards only where they follow exactly) and the
 * smooth fit of the model chosen in the fit section. Everything comes from the core; the fit is
 * built on `result`, which the workbench passes as its settled (deferred) build, so typing in a
 * cell never waits for it. Snapshots depend on their own inputs only and are rebuilt when those
 * or the choice change.
 */
export function useComparisonOverlay(result: WorkbenchBuild): ComparisonOverlay {
  // Narrow selections: a keystroke in a cell changes none of these, so it never re-renders this.
  const view = useAppStore((s) => s.workspace.view);
  const display = useAppStore((s) => s.workspace.display);
  const snapshotsValue = useAppStore((s) => s.workspace.snapshots);
  const sheetUnit = useAppStore((s) => s.workspace.quoteUnit);
  const choice = useMemo(() => comparisonChoice({ view }), [view]);
  const reference = useReferenceInput();
  const curve = result.build.curve;
  const ws = result.build.workspace;

  const snapshotKey = choice.snapshots.join('\u0000');
  // Rebuilt snapshots (the heavy part), only when the snapshots or the chosen names change.
  const rebuilt = useMemo(() => {
    const names = new Set(snapshotKey === '' ? [] : snapshotKey.split('\u0000'));
    const all = validateSnapshots(snapshotsValue).snapshots;
    const chosen = all.filter((s) => names.has(s.name));
    const present = new Set(all.map((s) => s.name));
    return {
      missing: [...names].filter((n) => !present.has(n)),
      drawn: chosen.slice(0, SNAPSHOT_OVERLAY_MAX).map((s) => ({ snapshot: s, curve: rebuildSnapshot(s).build.curve })),
      notDrawn: Math.max(0, chosen.length - SNAPSHOT_OVERLAY_MAX),
    };
  }, [snapshotsValue, snapshotKey]);

  // The same fit as the smooth fit section: its model and errors (view), its quotes left out and weights (this page).
  const { exclude, weights } = useFitInput();
  // With the shown curve's turns, as the section fits them (FitSlot).
  const turns = result.build.overnight?.turns;
  const held = result.build.instruments;
  const fitOptions = useMemo(
    () => (choice.fit && choice.fitModel !== 'none' ? { model: choice.fitModel, errors: choice.fitErrors, exclude, weights, ...(turns ? { turns } : {}), instruments: held } : null),
    [choice.fit, choice.fitModel, choice.fitErrors, exclude, weights, turns, held],
  );
  const fit = useLazyFit(ws, fitOptions);

  const referenceInput = useMemo(
    () => (choice.reference && reference.text.trim() !== '' ? { text: reference.text, compounding: reference.compounding, dayCount: reference.dayCount, unit: reference.unit ?? sheetUnit } : null),
    [choice.reference, reference.text, reference.compounding, reference.dayCount, reference.unit, sheetUnit],
  );
  const parsedReference = useLazyReference(referenceInput);

  return useMemo(() => {
    if (!curve) return EMPTY;
    const zero: ChartLine[] = [];
    const forward: ChartLine[] = [];
    const notes: string[] = [];
    const how = { zero: [] as string[], forward: [] as string[] };
    const tag = rateTag(display.compounding, display.dayCount);
    const fwd = `${display.forwardTenor} forward`;
    // Drawn within the base curve's maturity range (the charts' x axis ends there).
    const xMax = curve.time(chartEndDate(curve));
    const points = (s: Samples): SamplePoint[] => samplePoints(s).filter((p) => p.x <= xMax);

    rebuilt.drawn.forEach(({ snapshot, curve: c }, i) => {
      if (!c) {
        notes.push(`snapshot ${snapshot.name} not drawn: it does not build (see the Snapshots section)`);
        return;
      }
      const s = sampled(c, display);
      const other = c.settlement !== curve.settlement;
      const byDate = other && choice.by === 'date';
      const z = byDate ? samplesByDate(s.zero, curve) : s.zero;
      const f = byDate ? samplesByDate(s.forward, curve) : s.forward;
      if (other) {
        const line = `Snapshot ${snapshot.name}: settlement ${c.settlement}, lined up by ${byDate ? 'calendar date (its rates run from its own settlement)' : 'time to maturity (years from its own settlement)'}`;
        how.zero.push(line);
        how.forward.push(line);
      }
      const common = { tag, ...SNAPSHOT_STYLES[i]! };
      // Each point explained on the snapshot rebuilt from its inputs, as here (explainCell), at its own date.
      zero.push({ id: `snapshot-${i}-zero`, label: `Snapshot ${snapshot.name} (zero)`, points: points(z), ...common, explain: datedAt('zero', { snapshot }) });
      forward.push({ id: `snapshot-${i}-forward`, label: `Snapshot ${snapshot.name} (${fwd})`, points: points(f), ...common, explain: datedAt('forward', { snapshot }) });
    });
    if (rebuilt.missing.length > 0) notes.push(`not drawn, not among this workspace's snapshots (removed, or opened from a link, which leaves snapshots out): ${rebuilt.missing.join(', ')}`);
    if (rebuilt.notDrawn > 0) notes.push(`${rebuilt.notDrawn} more snapshot${rebuilt.notDrawn === 1 ? '' : 's'} chosen, not drawn (the charts show the first ${SNAPSHOT_OVERLAY_MAX})`);

    if (choice.reference) {
      if (!parsedReference) notes.push('reference curve not drawn: import one without errors in the Snapshots section (it is kept in this page only, not saved)');
      else {
        const z = referenceZeroSamples(parsedReference, curve, display.compounding, display.dayCount);
        const f = referenceForwardSamples(parsedReference, curve, parseTenor(display.forwardTenor)!, display.compounding, display.dayCount);
        const common = { tag, ...REFERENCE_STYLE };
        const read = `Reference: its dates from settlement ${curve.settlement}, by date, joined by straight lines`;
        how.zero.push(f.exact ? read : `${read}; zero chart only: no two of its dates are ${display.forwardTenor} apart, so no ${fwd} follows from it exactly`);
        zero.push({ id: 'reference-zero', label: f.exact ? 'Reference (zero)' : 'Reference (zero; zero chart only)', points: points(z), ...common, explain: datedAt('zero', { refCurve: parsedReference }) });
        if (f.exact) {
          how.forward.push(`${read}; only ${fwd}s from one of its dates to another`);
          forward.push({ id: 'reference-forward', label: `Reference (${fwd})`, points: points(f.samples), ...common, explain: datedAt('forward', { refCurve: parsedReference }) });
        }
      }
    }

    if (choice.fit) {
      if (choice.fitModel === 'none') notes.push('smooth fit not drawn: choose a model in the Smooth fit section');
      else if (fit && !fit.ok) notes.push(`smooth fit not drawn: ${fit.errors[0]?.message ?? 'it did not converge'}`);
      else if (fit && fit.ok) {
        const s = sampled(fit.value.curve, display);
        const label = FIT_MODEL_LABEL[choice.fitModel];
        const common = { tag, ...FIT_STYLE };
        const left = new Set([...exclude, ...Object.entries(weights).flatMap(([i, w]) => (w === 0 ? [Number(i)] : []))]).size;
        const weighted = Object.values(weights).some((w) => w !== 1 && w !== 0);
        const line = `${label} fit: ${choice.fitErrors} errors${left > 0 ? `, ${left} quote${left === 1 ? '' : 's'} left out` : ', every quote'}${weighted ? ', weighted' : ''}, as set in the Smooth fit section`;
        how.zero.push(line);
        how.forward.push(line);
        // Its point explains itself: the fitted zero rate on the date, as sampled (display compounding and day count).
        zero.push({ id: 'fit-zero', label: `${label} fit (zero)`, points: points(s.zero), ...common, explain: (p: SamplePoint) => ({ fit: { options: fitOptions!, index: -1, figure: 'zero', date: p.date, compounding: display.compounding, dayCount: display.dayCount } }) });
        forward.push({ id: 'fit-forward', label: `${label} fit (${fwd})`, points: points(s.forward), ...common, explain: (p: SamplePoint) => ({ fit: { options: fitOptions!, index: -1, figure: 'zero', date: p.date, end: marketDate(p.date, parseTenor(display.forwardTenor)!), compounding: display.compounding, dayCount: display.dayCount } }) });
      }
    }
    return { zero, forward, notes, how };
  }, [curve, display, rebuilt, choice.by, choice.reference, choice.fit, choice.fitModel, choice.fitErrors, exclude, weights, parsedReference, fit, fitOptions]);
}
