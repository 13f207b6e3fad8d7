import { useAppStore } from '../state/store.ts';
import { baseBuildOf } from './useCurveBuild.ts';
import { baseCurveSeries } from './useCurveSeries.ts';

/**
 * What the first render needs from the core, as steps the entry point runs one task each between
 * the restore and the first render: the base build, then the charts' samples. Each result is what
 * the hooks derive (reused by identity: useCurveBuild, useCurveSeries), so the first render finds
 * them made and no result changes. Performance: on reload of a 500-quote workspace the build and
 * the samples were about 40 ms of a single long task with the render.
 */
export const FIRST_FRAME_STEPS: readonly (() => void)[] = [
  () => void baseBuildOf(useAppStore.getState().workspace),
  () => {
    const ws = useAppStore.getState().workspace;
    const { build } = baseBuildOf(ws);
    if (build.curve) baseCurveSeries(build.curve, ws.display, build.repricing);
  },
];
