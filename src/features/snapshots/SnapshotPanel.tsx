import { useMemo, useState } from 'react';
import { compareCurves, COMPARISON_TENORS, rebuildSnapshot, takeSnapshot, type CompareBy, type Snapshot } from '../../core/index.ts';
import { validateSnapshots } from '../../core/index.ts';
import { formatBpChange, formatPercent, rateTag, type Compounding, type Curve, type CurveDayCount, type DisplaySettings } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import type { DifferenceCell } from './explainDifferenceCell.ts';
import type { DatedCell } from '../tables/explainCell.ts';
import { OpenExplanation, useExplainOpener } from '../tables/explainOpener.tsx';
import { EditLock } from '../../components/EditLock.tsx';
import '../scenarios/scenarios.css';

export interface SnapshotPanelProps {
  /** The document's `snapshots` value as stored (validated here). */
  readonly value: unknown;
  readonly onChange: (next: Snapshot[]) => void;
  /** The engine document of the current inputs (what a snapshot freezes); null when there is none. */
  readonly currentDocument: Record<string, unknown> | null;
  readonly current: Curve | null;
  /** The time now as ISO 8601 with its offset, for the snapshot's label (the UI owns the clock). */
  readonly now: () => string;
  readonly compounding: Compounding;
  readonly dayCount: CurveDayCount;
  readonly tenors?: readonly string[];
  /** How another settlement lines up (controlled when onByChange is given; the charts' comparisons share it). */
  readonly by?: CompareBy;
  readonly onByChange?: (by: CompareBy) => void;
  /** With it, each difference opens its explanation (the build the current curve is, and the display). */
  readonly explainFrom?: { readonly result: WorkbenchBuild; readonly display: DisplaySettings };
}

/** A difference, or a zero rate of either curve (a DatedCell; `snapshot` for the snapshot's). */
type SnapshotCell = DifferenceCell | DatedCell;
const sameCell = (a: SnapshotCell, b: SnapshotCell): boolean =>
  'difference' in a ? 'difference' in b && a.difference.snapshot === b.difference.snapshot && a.difference.tenor === b.difference.tenor : !('difference' in b) && a.start === b.start && a.snapshot === b.snapshot;

/** Snapshots: freeze the inputs under a name, rebuild them, and difference the current curve against one. */
export function SnapshotPanel({ value, onChange, currentDocument, current, now, compounding, dayCount, tenors = COMPARISON_TENORS, by: byProp, onByChange, explainFrom }: SnapshotPanelProps) {
  const { snapshots, errors } = useMemo(() => validateSnapshots(value), [value]);
  const [name, setName] = useState('');
  const [chosen, setChosen] = useState(0);
  const [byLocal, setByLocal] = useState<CompareBy>(byProp ?? 'time');
  const by = onByChange ? (byProp ?? 'time') : byLocal;
  const setBy = onByChange ?? setByLocal;
  const rebuilt = useMemo(() => snapshots.map((s) => rebuildSnapshot(s)), [snapshots]);
  const pick = Math.min(chosen, snapshots.length - 1);
  const other = pick >= 0 ? rebuilt[pick]?.build.curve ?? null : null;
  const rows = current && other ? compareCurves(current, other, tenors, by, compounding, dayCount) : [];
  const tag = rateTag(compounding, dayCount);
  const opener = useExplainOpener<SnapshotCell>(sameCell);
  const chosenSnapshot = pick >= 0 ? snapshots[pick] : undefined;
  // The open difference follows the table: the snapshot chosen now, the line-up and the convention shown.
  const o = opener.open;
  const open: SnapshotCell | null =
    o === null || !chosenSnapshot ? null
    : 'difference' in o ? (rows.some((r) => r.tenor === o.difference.tenor && r.differenceBp !== null) ? { difference: { ...o.difference, snapshot: chosenSnapshot, by, compounding, dayCount } } : null)
    : rows.some((r) => (o.snapshot ? r.otherDate : r.date) === o.start) ? { ...o, ...(o.snapshot ? { snapshot: chosenSnapshot } : {}) } : null;
  /** A zero rate of the current curve, or with `snapshot` of the snapshot's, opening its explanation (in the display's convention, as the table shows it). */
  const zeroCell = (date: string, zero: number | null, snapshot?: Snapshot) => {
    const text = formatPercent(zero);
    if (!explainFrom || !chosenSnapshot || zero === null) return text;
    const cell: DatedCell = { field: 'zero', start: date, ...(snapshot ? { snapshot } : {}) };
    return opener.button(cell, text, `the ${snapshot ? `${snapshot.name}` : 'current'} zero rate on ${date}`);
  };
  const differenceCell = (tenor: string, bp: number | null) => {
    const text = formatBpChange(bp);
    if (!explainFrom || !chosenSnapshot || bp === null) return text;
    const cell: DifferenceCell = { difference: { snapshot: chosenSnapshot, tenor, by, compounding, dayCount } };
    return opener.button(cell, text, `the difference of the ${tenor} zero rate from ${chosenSnapshot.name}`);
  };
  const take = (): void => {
    if (!currentDocument) return;
    onChange([...snapshots, takeSnapshot(currentDocument, name.trim() || `Snapshot ${snapshots.length + 1}`, now())]);
    setName('');
  };
  return (
    <section className="snapshot-panel" aria-label="Snapshots">
      {errors.length > 0 && (
        <div className="banner" role="alert">
          Some saved snapshots could not be read: {errors.slice(0, 3).map((e) => e.message).join('; ')}
        </div>
      )}
      <EditLock>
      <div className="settings">
        <label>
          Snapshot name
          <input value={name} onChange={(e) => setName(e.target.value)} maxLength={80} placeholder="Last week's close" />
        </label>
        <button type="button" onClick={take} disabled={!currentDocument || snapshots.length >= 20}>
          Take snapshot
        </button>
        <span className="muted small">Keeps the quotes, settings and settlement; the curve is rebuilt from them, never stored.</span>
      </div>
      </EditLock>
      {snapshots.length === 0 ? (
        <p className="muted">No snapshots yet.</p>
      ) : (
        <>
          <EditLock>
          <ul className="snapshot-list">
            {snapshots.map((s, i) => {
              const r = rebuilt[i]!;
              return (
                <li key={`${s.name}-${i}`}>
                  <label>
                    <input type="radio" name="snapshot-compare" checked={i === pick} onChange={() => setChosen(i)} /> <strong>{s.name}</strong>
                  </label>{' '}
                  <span className="muted small">
                    taken {s.takenAt}, settlement {s.settlement}
                  </span>{' '}
                  {!r.build.curve ? (
                    <span className="field-error">does not build: {r.build.errors[0]?.message}</span>
                  ) : r.changed ? (
                    <span className="warn" role="status">
                      this build rebuilds it differently (curve hash {s.curveHash} then, {r.hash} now)
                    </span>
                  ) : (
                    <span className="muted small">rebuilds the same (hash {r.hash})</span>
                  )}{' '}
                  <button type="button" onClick={() => onChange(snapshots.filter((_, k) => k !== i))} aria-label={`Remove snapshot ${s.name}`}>
                    Remove
                  </button>
                </li>
              );
            })}
          </ul>
          <fieldset className="segmented">
            <legend>Line up by</legend>
            <label className={by === 'time' ? 'on' : ''}>
              <input type="radio" name="snapshot-by" checked={by === 'time'} onChange={() => setBy('time')} /> time to maturity
            </label>
            <label className={by === 'date' ? 'on' : ''}>
              <input type="radio" name="snapshot-by" checked={by === 'date'} onChange={() => setBy('date')} /> calendar date
            </label>
          </fieldset>
          </EditLock>
          {rows.length > 0 && (
            <table className="data" aria-label="Current curve against the snapshot">
              <caption className="small muted">
                Zero rates ({tag}); difference = current − snapshot, bp{explainFrom ? '. Choose a difference to see how it is made.' : ''}
              </caption>
              <thead>
                <tr>
                  <th>Tenor</th>
                  <th>Date</th>
                  <th>Current</th>
                  <th>Snapshot date</th>
                  <th>Snapshot</th>
                  <th>Difference</th>
                </tr>
              </thead>
              <tbody>
                {rows.map((r) => (
                  <tr key={r.tenor}>
                    <th scope="row">{r.tenor}</th>
                    <td>{r.date}</td>
                    <td className="num">{zeroCell(r.date, r.zero)}</td>
                    <td>{r.otherDate}</td>
                    <td className="num">{zeroCell(r.otherDate, r.otherZero, chosenSnapshot)}</td>
                    <td className="num">{differenceCell(r.tenor, r.differenceBp)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
          {explainFrom ? <OpenExplanation result={explainFrom.result} display={explainFrom.display} cell={open} onClose={opener.close} /> : null}
        </>
      )}
    </section>
  );
}
