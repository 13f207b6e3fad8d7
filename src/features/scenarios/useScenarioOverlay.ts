import { useMemo } from 'react';
import { applyScenario } from '../../core/index.ts';
import { validateScenarios } from '../../core/index.ts';
import { COMPOUNDING_LABEL } from '../../core/index.ts';
import type { ChartLine } from '../../charts/RateChart.tsx';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { curveSeries } from '../../hooks/useCurveSeries.ts';
import { useAppStore } from '../../state/store.ts';

/** Colours and dashes of the scenario lines drawn over the base curve (at most four). */
export const SCENARIO_COLOURS = ['#c4581d', '#187a5e', '#6b4fa0', '#8a5a00'] as const;
export const SCENARIO_OVERLAY_MAX = 4;
const BUILD = { skipInvalid: true } as const;

/**
 * Lines of the first four scenarios for the zero and forward charts (each scenario's curve from the
 * core, sampled like the base curve), with the scenario's name in the legend. Empty without a curve.
 */
export function useScenarioOverlay(result: WorkbenchBuild): { zero: ChartLine[]; forward: ChartLine[] } {
  const value = useAppStore((s) => s.workspace.scenarios);
  const display = useAppStore((s) => s.workspace.display);
  const curve = result.build.curve;
  const ws = result.build.workspace;
  return useMemo(() => {
    const zero: ChartLine[] = [];
    const forward: ChartLine[] = [];
    if (!curve || !ws) return { zero, forward };
    const tag = `${COMPOUNDING_LABEL[display.compounding]}, ${display.dayCount}`;
    validateScenarios(value)
      .scenarios.slice(0, SCENARIO_OVERLAY_MAX)
      .forEach((s, i) => {
        const r = applyScenario(s, ws, curve, BUILD);
        if (!r.ok) return;
        const series = curveSeries(r.value.curve, display, []);
        const common = { tag, colour: SCENARIO_COLOURS[i]!, dash: '5 3', width: 1.4 };
        zero.push({ id: `scenario-${s.id}-zero`, label: `${s.name} (zero)`, points: series.zero, ...common });
        forward.push({ id: `scenario-${s.id}-forward`, label: `${s.name} (${display.forwardTenor} forward)`, points: series.forward, ...common });
      });
    return { zero, forward };
  }, [value, display, curve, ws]);
}
