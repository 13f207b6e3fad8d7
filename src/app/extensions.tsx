import type { ReactNode } from 'react';
import type { WorkbenchBuild } from '../hooks/useCurveBuild.ts';

/** A section in the tab strip under the charts. */
export interface WorkbenchTab {
  readonly id: string;
  readonly label: string;
  readonly render: (props: { result: WorkbenchBuild }) => ReactNode;
}

/**
 * Wiring point for the panels other features add to the workbench. Each takes the base build
 * as a prop and reads or writes its own key of the workspace document through the store
 * (`useAppStore`, `setReserved('strategy' | 'scenarios' | 'snapshots' | 'view' | 'note', value)`).
 *
 * - `rollPanel`: the "Roll versus term" panel, shown in the slot beside the charts.
 * - `tabs`: extra sections in the tab strip under the charts (scenarios, fits, risk, print...).
 * - `printHost`: always mounted, renders nothing on screen; makes any print of the page give the
 *   one-page summary (features/print/PrintOnDemand.tsx).
 *
 * Empty by default (component tests render the bare workbench); the app's entry point fills it
 * with installFeaturePanels() (src/app/installFeaturePanels.tsx) before the first render.
 */
export interface WorkbenchExtensions {
  rollPanel: ((props: { result: WorkbenchBuild }) => ReactNode) | null;
  tabs: WorkbenchTab[];
  printHost: ((props: { result: WorkbenchBuild }) => ReactNode) | null;
}

export const EXTENSIONS: WorkbenchExtensions = {
  rollPanel: null,
  tabs: [],
  printHost: null,
};
