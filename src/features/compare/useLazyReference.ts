import { useEffect, useState } from 'react';
import type { CurveDayCount, Compounding, QuoteUnitMode, ReferenceCurve } from '../../core/index.ts';

/** What the reference curve is read from: the pasted CSV text and how its rates are quoted. */
export interface ReferenceInput {
  readonly text: string;
  readonly compounding: Compounding;
  readonly dayCount: CurveDayCount;
  readonly unit: QuoteUnitMode;
}

/**
 * The reference curve read from its text with the reader fetched on first use (referenceLine.ts):
 * null while none is asked for, while the reader is on its way, or when the text gives no curve.
 * The same input object gives the same curve object, as a memo would.
 */
export function useLazyReference(input: ReferenceInput | null): ReferenceCurve | null {
  const [state, setState] = useState<{ input: ReferenceInput; curve: ReferenceCurve | null } | null>(null);
  useEffect(() => {
    if (!input) return;
    let live = true;
    void import('./referenceLine.ts').then(({ parseReferenceCsv }) => {
      if (live) setState({ input, curve: parseReferenceCsv(input.text, input.compounding, input.dayCount, input.unit).reference ?? null });
    });
    return () => {
      live = false;
    };
  }, [input]);
  return input && state && state.input === input ? state.curve : null;
}
