import { create } from 'zustand';
import type { Compounding, CurveDayCount, QuoteUnitMode } from '../../core/index.ts';

/**
 * What the reference curve panel holds: the CSV text and how to read it. Kept in this page only
 * (never saved with the workspace, as before), shared by the panel and the charts' comparisons.
 */
export interface ReferenceInput {
  readonly text: string;
  readonly compounding: Compounding;
  readonly dayCount: CurveDayCount;
  /** How bare zero rates are read; null: in the sheet's unit. */
  readonly unit: QuoteUnitMode | null;
  set(patch: Partial<Omit<ReferenceInput, 'set'>>): void;
}

export const useReferenceInput = create<ReferenceInput>()((set) => ({
  text: '',
  compounding: 'continuous',
  dayCount: 'ACT/365F',
  unit: null,
  set: (patch) => set(patch),
}));
