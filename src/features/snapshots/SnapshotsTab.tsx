import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import { comparisonChoice, setCompareBy } from '../compare/comparisonChoice.ts';
import { ReferenceCurvePanel } from './ReferenceCurvePanel.tsx';
import { SnapshotPanel } from './SnapshotPanel.tsx';

/** Local time as ISO 8601 with its UTC offset, for a snapshot's label. */
function nowWithOffset(): string {
  const d = new Date();
  const off = -d.getTimezoneOffset();
  const pad = (n: number): string => String(Math.floor(Math.abs(n))).padStart(2, '0');
  const local = new Date(d.getTime() + off * 60_000).toISOString().slice(0, 19);
  return `${local}${off >= 0 ? '+' : '-'}${pad(off / 60)}:${pad(off % 60)}`;
}

/** Snapshots and the reference curve, wired to the workbench store (`snapshots` key). */
export function SnapshotsTab({ result }: { result: WorkbenchBuild }) {
  const value = useAppStore((s) => s.workspace.snapshots);
  const display = useAppStore((s) => s.workspace.display);
  const by = useAppStore((s) => comparisonChoice(s.workspace).by);
  return (
    <>
      {/* The panel locks its own editing controls, so a read-only workspace still opens its differences' explanations. */}
      <SnapshotPanel
        value={value}
        onChange={(next) => useAppStore.getState().setReserved('snapshots', next)}
        currentDocument={result.build.workspace ? result.conversion.doc : null}
        current={result.build.curve}
        now={nowWithOffset}
        compounding={display.compounding}
        dayCount={display.dayCount}
        by={by}
        onByChange={setCompareBy}
        explainFrom={{ result, display }}
      />
      <h3>Reference curve</h3>
      <ReferenceCurvePanel curve={result.build.curve} explainFrom={{ result, display }} />
    </>
  );
}
