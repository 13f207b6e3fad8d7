import { useMemo } from 'react';
import { FIT_MODEL_LABEL, FIT_MODELS, validateSnapshots, type FitModel } from '../../core/index.ts';
import { SNAPSHOT_OVERLAY_MAX } from '../../charts/palette.ts';
import { useAppStore } from '../../state/store.ts';
import { comparisonChoice, setCompareBy, setDrawFit, setDrawReference, setFitModel, toggleSnapshot } from './comparisonChoice.ts';
import { useReferenceInput } from './referenceInput.ts';
import { EditLock } from '../../components/EditLock.tsx';

/** The charts' comparison choices (saved in the document's view): snapshots by name, the reference curve, the smooth fit. */
export function ComparisonControls({ drawn }: { drawn: number }) {
  const view = useAppStore((s) => s.workspace.view);
  const choice = useMemo(() => comparisonChoice({ view }), [view]);
  const snapshotsValue = useAppStore((s) => s.workspace.snapshots);
  const names = useMemo(() => [...new Set(validateSnapshots(snapshotsValue).snapshots.map((s) => s.name))], [snapshotsValue]);
  const hasReference = useReferenceInput((s) => s.text.trim() !== '');
  const chosen = new Set(choice.snapshots);
  const present = new Set(names);
  // Chosen names with no snapshot here stay listed, so they can be unticked.
  const missing = choice.snapshots.filter((n) => !present.has(n));
  return (
    <details className="comparisons">
      <summary>Compare on the charts{drawn > 0 ? ` (${drawn} line${drawn === 1 ? '' : 's'} per chart)` : ''}</summary>
      <EditLock>
      <div className="comparison-choices">
        <fieldset>
          <legend>Snapshots (at most {SNAPSHOT_OVERLAY_MAX} drawn)</legend>
          {missing.map((n) => (
            <label key={`missing-${n}`}>
              <input type="checkbox" checked onChange={() => toggleSnapshot(choice.snapshots, n, false)} /> {n} <span className="muted small">(not in this workspace)</span>
            </label>
          ))}
          {names.length === 0 && <p className="muted small">No snapshots yet: take one in the Snapshots section.</p>}
          {names.map((n) => (
            <label key={n}>
              <input type="checkbox" checked={chosen.has(n)} onChange={(e) => toggleSnapshot(choice.snapshots, n, e.target.checked)} /> {n}
            </label>
          ))}
        </fieldset>
        <fieldset>
          <legend>Another settlement lines up by</legend>
          <label>
            <input type="radio" name="compare-by" checked={choice.by === 'time'} onChange={() => setCompareBy('time')} /> time to maturity
          </label>
          <label>
            <input type="radio" name="compare-by" checked={choice.by === 'date'} onChange={() => setCompareBy('date')} /> calendar date
          </label>
        </fieldset>
        <fieldset>
          <legend>Other curves</legend>
          <label>
            <input type="checkbox" checked={choice.reference} onChange={(e) => setDrawReference(e.target.checked)} /> Reference curve
            {!hasReference && <span className="muted small"> (import one in the Snapshots section; kept in this page only)</span>}
          </label>
          <label>
            <input type="checkbox" checked={choice.fit} onChange={(e) => setDrawFit(e.target.checked)} /> Smooth fit
          </label>
          <label>
            Fit model
            <select value={choice.fitModel} onChange={(e) => setFitModel(e.target.value as FitModel | 'none')}>
              {FIT_MODELS.map((m) => (
                <option key={m} value={m}>
                  {FIT_MODEL_LABEL[m]}
                </option>
              ))}
              <option value="none">none</option>
            </select>
          </label>
        </fieldset>
      </div>
      </EditLock>
    </details>
  );
}
