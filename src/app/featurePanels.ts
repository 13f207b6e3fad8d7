/**
 * Every feature panel the workbench loads after its first chart, behind one import()
 * (installFeaturePanels.tsx): one module for the bundler to split off, so the panels and what
 * they share travel in one compressed chunk instead of a file each. A new panel is exported here.
 */
export { RollSlot, RollResultLine } from '../features/roll/RollSlot.tsx';
export { ScenariosTab } from '../features/scenarios/ScenariosTab.tsx';
export { SnapshotsTab } from '../features/snapshots/SnapshotsTab.tsx';
export { FitSlot } from '../features/compare/FitSlot.tsx';
export { BondAnalyticsPanel } from '../features/risk/BondAnalyticsPanel.tsx';
export { SensitivityHeatMap } from '../features/risk/SensitivityHeatMap.tsx';
export { PrintTab } from '../features/print/PrintTab.tsx';
export { PrintOnDemand } from '../features/print/PrintOnDemand.tsx';
export { HolidaysTab } from '../features/calendars/HolidaysTab.tsx';
export { FixingsTab } from '../features/calendars/FixingsTab.tsx';
export { OvernightTab } from '../features/overnight/OvernightTab.tsx';
