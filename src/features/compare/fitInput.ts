import { create } from 'zustand';

/**
 * The smooth fit section's quote choices (left out, weights by quote index), shared with the charts'
 * fit line so both show the same fit. Kept in this page only, as the section always kept them (a
 * workspace of up to 500 quotes would not fit the view's short lists); the model and the error
 * measure are in the document's view.
 */
export interface FitInput {
  readonly exclude: readonly number[];
  readonly weights: Readonly<Record<number, number>>;
  set(patch: Partial<Omit<FitInput, 'set'>>): void;
}

export const useFitInput = create<FitInput>()((set) => ({
  exclude: [],
  weights: {},
  set: (patch) => set(patch),
}));
