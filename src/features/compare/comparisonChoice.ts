import { isFitModel, type CompareBy, type FitErrors, type FitModel, type WorkbenchDocument } from '../../core/index.ts';
import { setViewValues, viewList, viewOf, viewText } from '../../state/viewValues.ts';

/**
 * Which comparisons the charts draw, kept in the document's `view` (saved, undone and shared with
 * the workspace): snapshots by name, the imported reference curve, the smooth fit; the fit model
 * chosen in the smooth fit section; and how curves of another settlement line up (shared with the
 * snapshot table's choice).
 */
export interface ComparisonChoice {
  readonly snapshots: readonly string[];
  readonly reference: boolean;
  readonly fit: boolean;
  readonly fitModel: FitModel | 'none';
  /** The fit's error measure, as chosen in the smooth fit section. */
  readonly fitErrors: FitErrors;
  readonly by: CompareBy;
}

export const VIEW_KEYS = { snapshots: 'compareSnapshots', reference: 'compareReference', fit: 'compareFit', fitModel: 'fitModel', fitErrors: 'fitErrors', by: 'compareBy' } as const;

export function comparisonChoice(doc: Pick<WorkbenchDocument, 'view'>): ComparisonChoice {
  const d = doc as WorkbenchDocument; // the view readers look at `view` only
  const v = viewOf(d);
  const model = viewText(d, VIEW_KEYS.fitModel, 'nelson-siegel');
  return {
    snapshots: viewList(d, VIEW_KEYS.snapshots, []),
    reference: v[VIEW_KEYS.reference] === true,
    fit: v[VIEW_KEYS.fit] === true,
    fitModel: isFitModel(model) ? model : model === 'none' ? 'none' : 'nelson-siegel',
    fitErrors: viewText(d, VIEW_KEYS.fitErrors, 'yield') === 'price' ? 'price' : 'yield',
    by: viewText(d, VIEW_KEYS.by, 'time') === 'date' ? 'date' : 'time',
  };
}

/** Draws or stops drawing the snapshot `name` (one undo step). */
export function toggleSnapshot(current: readonly string[], name: string, on: boolean): void {
  const next = on ? [...current.filter((n) => n !== name), name] : current.filter((n) => n !== name);
  setViewValues({ [VIEW_KEYS.snapshots]: next }, on ? `Draw snapshot ${name}` : `Stop drawing snapshot ${name}`);
}

export const setDrawReference = (on: boolean): void => setViewValues({ [VIEW_KEYS.reference]: on }, on ? 'Draw the reference curve' : 'Stop drawing the reference curve');
export const setDrawFit = (on: boolean): void => setViewValues({ [VIEW_KEYS.fit]: on }, on ? 'Draw the smooth fit' : 'Stop drawing the smooth fit');
export const setFitModel = (m: FitModel | 'none'): void => setViewValues({ [VIEW_KEYS.fitModel]: m }, 'Choose the fit model');
export const setFitErrors = (e: FitErrors): void => setViewValues({ [VIEW_KEYS.fitErrors]: e }, 'Choose the fit errors');
export const setCompareBy = (by: CompareBy): void => setViewValues({ [VIEW_KEYS.by]: by }, by === 'date' ? 'Line up by calendar date' : 'Line up by time to maturity');
