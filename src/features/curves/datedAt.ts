import type { SamplePoint } from '../../hooks/useCurveSeries.ts';
import type { DatedCell } from '../tables/explainCell.ts';

/**
 * A chart line's explanation factory (ChartLine.explain): its point as a number by its date, read on
 * the line's own curve (`on`: a method, a scenario, a snapshot; the build's curve without one).
 */
export const datedAt =
  (field: DatedCell['field'], on?: Partial<DatedCell>) =>
  (p: SamplePoint): DatedCell => ({ field, start: p.date, ...on });
