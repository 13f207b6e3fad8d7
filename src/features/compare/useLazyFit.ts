import { useEffect, useState } from 'react';
import type { FitOptions, FitResult, Result, Workspace } from '../../core/index.ts';

type FitOutcome = Result<FitResult>;

/**
 * The smooth fit of a workspace, computed with the fitting code fetched on first use (fitLine.ts):
 * null while no fit is asked for or until the code has arrived (the charts then draw it on the next
 * render). The same inputs give the same fit object, as a memo would.
 */
export function useLazyFit(ws: Workspace | null, options: FitOptions | null): FitOutcome | null {
  const [state, setState] = useState<{ ws: Workspace; options: FitOptions; outcome: FitOutcome } | null>(null);
  useEffect(() => {
    if (!ws || !options) return;
    let live = true;
    void import('./fitLine.ts').then(({ fitCurve }) => {
      if (live) setState({ ws, options, outcome: fitCurve(ws, options) });
    });
    return () => {
      live = false;
    };
  }, [ws, options]);
  return ws && options && state && state.ws === ws && state.options === options ? state.outcome : null;
}
