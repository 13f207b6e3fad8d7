import { workbenchBuildOptions } from '../../hooks/overnightKit.ts';
import { useMemo } from 'react';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import { ScenarioPanel } from './ScenarioPanel.tsx';
import { useOnCurve } from '../../hooks/useNamedCurves.ts';
import { applyToShown } from './applyShown.ts';
import type { Scenario } from '../../core/index.ts';


/** The scenario panel wired to the workbench store: reads and writes the document's `scenarios`. */
export function ScenariosTab({ result }: { result: WorkbenchBuild }) {
  const value = useAppStore((s) => s.workspace.scenarios);
  const display = useAppStore((s) => s.workspace.display);
  const conventions = useMemo(
    () => ({ zeroCompounding: display.compounding, zeroDayCount: display.dayCount, forwardTenor: display.forwardTenor, forwardCompounding: display.compounding, forwardDayCount: display.dayCount }),
    [display],
  );
  // With named curves, which curve the scenarios move: the curve shown (the default one, or the picker's choice).
  const on = useOnCurve(result.curveName);
  const apply = useMemo(() => (s: Scenario, i: number) => applyToShown(s, result, workbenchBuildOptions(), `scenarios[${i}]`), [result]);
  // The curves built on the one shown, which a quote-space scenario on it rebuilds too.
  const moves = result.onCurves?.built.filter((c) => c.discountCurve === result.curveName).map((c) => `"${c.name}"`) ?? [];
  // The panel locks its own editing controls, so a read-only workspace still opens its changes' explanations.
  return (
    <>
    {on && (
      <p className="muted small">
        Scenarios{on}, the curve shown{moves.length > 0 ? `; moving its quotes rebuilds ${moves.join(', ')} on it too` : ''}.
      </p>
    )}
    <ScenarioPanel
      value={value}
      onChange={(next) => useAppStore.getState().setReserved('scenarios', next)}
      workspace={result.build.workspace}
      base={result.build.curve}
      buildOptions={workbenchBuildOptions()}
      conventions={conventions}
      explainFrom={{ result, display }}
      apply={apply}
    />
    </>
  );
}
