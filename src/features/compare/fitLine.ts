/**
 * The smooth fit for the charts' comparison lines, fetched when a fit is first asked for (its own
 * chunk with the fit section), so the first load does not carry the fitting code.
 */
export { fitCurve } from '../../core/index.ts';
