import { workbenchBuildOptions } from '../../hooks/overnightKit.ts';
import { useMemo } from 'react';
import { applyToShown } from './applyShown.ts';
import { validateScenarios } from '../../core/index.ts';
import { rateTag } from '../../core/index.ts';
import type { ChartLine } from '../../charts/RateChart.tsx';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { curveSeries } from '../../hooks/useCurveSeries.ts';
import { useAppStore } from '../../state/store.ts';

import { SCENARIO_OVERLAY_MAX, SCENARIO_STYLES } from '../../charts/palette.ts';
import { datedAt } from '../curves/datedAt.ts';

/**
 * Lines of the first SCENARIO_OVERLAY_MAX scenarios for the zero and forward charts (each scenario's curve from the
 * core, sampled like the base curve), with the scenario's name in the legend, and how many scenarios were left undrawn (past the cap, or failing to build: by name). Empty without a curve.
 */
export function useScenarioOverlay(result: WorkbenchBuild): { zero: ChartLine[]; forward: ChartLine[]; notDrawn: number; failed: string[] } {
  const value = useAppStore((s) => s.workspace.scenarios);
  const display = useAppStore((s) => s.workspace.display);
  const curve = result.build.curve;
  const ws = result.build.workspace;
  return useMemo(() => {
    const zero: ChartLine[] = [];
    const forward: ChartLine[] = [];
    const failed: string[] = [];
    if (!curve || !ws) return { zero, forward, notDrawn: 0, failed };
    const tag = rateTag(display.compounding, display.dayCount);
    const { scenarios } = validateScenarios(value);
    scenarios
      .slice(0, SCENARIO_OVERLAY_MAX)
      .forEach((s, i) => {
        const r = applyToShown(s, result, workbenchBuildOptions());
        if (!r.ok) {
          failed.push(s.name);
          return;
        }
        const series = curveSeries(r.value.curve, display, []);
        const common = { tag, ...SCENARIO_STYLES[i]! };
        // Each point explained on the scenario curve made again as here (explainCell: applyToShown).
        zero.push({ id: `scenario-${s.id}-zero`, label: `${s.name} (zero)`, points: series.zero, ...common, explain: datedAt('zero', { scenario: s }) });
        forward.push({ id: `scenario-${s.id}-forward`, label: `${s.name} (${display.forwardTenor} forward)`, points: series.forward, ...common, explain: datedAt('forward', { scenario: s }) });
      });
    return { zero, forward, notDrawn: Math.max(0, scenarios.length - SCENARIO_OVERLAY_MAX), failed };
  }, [value, display, curve, ws, result]);
}
