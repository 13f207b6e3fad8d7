import { DEFAULT_CURVE_NAME, isPlainObject, SPREAD_MEASURES, type SpreadMeasure } from '../../core/index.ts';

/**
 * The named-curve choices kept in the document's `view` (saved, undone, in the link and the file):
 * which curve the charts and tables show, and which two curves the spread compares and how. The
 * default curve is the empty text; a name no curve has reads as the default (the curve may have
 * been renamed in the file).
 */
export const VIEW_KEYS = { shown: 'shownCurve', of: 'spreadOf', over: 'spreadOver', measure: 'spreadMeasure' } as const;
/** The word for the top-level curve (the sheet's), as the document's `discountCurve` names it. */
export const DEFAULT_NAME = DEFAULT_CURVE_NAME;

const text = (view: unknown, key: string): string => (isPlainObject(view) && typeof view[key] === 'string' ? view[key] : '');

export interface CurveChoice {
  /** The curve shown: '' for the default curve, else a named curve's name. */
  readonly shown: string;
  /** The spread is curve `of` minus curve `over` ('' for the default curve). */
  readonly of: string;
  readonly over: string;
  readonly measure: SpreadMeasure;
}

/** The choices of a document's view, each checked against the names of the curves that exist. */
export function curveChoice(view: unknown, names: readonly string[]): CurveChoice {
  const known = (n: string): string => (names.includes(n) ? n : '');
  const measure = text(view, VIEW_KEYS.measure);
  return {
    shown: known(text(view, VIEW_KEYS.shown)),
    of: known(text(view, VIEW_KEYS.of)) || (names[0] ?? ''),
    over: known(text(view, VIEW_KEYS.over)),
    measure: (SPREAD_MEASURES as readonly string[]).includes(measure) ? (measure as SpreadMeasure) : 'zero',
  };
}
