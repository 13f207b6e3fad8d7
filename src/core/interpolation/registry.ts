import { interpolatorCubicZero } from './cubicZero.ts';
import { interpolatorLinearZero, linearZeroSegmentLn } from './linearZero.ts';
import { interpolatorLogLinearDiscount, logLinearSegmentLn } from './logLinearDiscount.ts';
import {
  interpolatorMonotoneConvex,
  interpolatorMonotoneConvexPositive,
  monotoneConvexPositiveSegmentLn,
  monotoneConvexSegmentLn,
} from './monotoneConvex.ts';
import type { InterpolationId, InterpolatorSpec } from './types.ts';

/** Every interpolation method the engine offers, by identifier. */
export const INTERPOLATORS: Readonly<Record<InterpolationId, InterpolatorSpec>> = {
  'linear-zero': { id: 'linear-zero', build: interpolatorLinearZero, global: false, affine: true, segmentLn: linearZeroSegmentLn, label: 'Linear zero' },
  'log-linear-discount': { id: 'log-linear-discount', build: interpolatorLogLinearDiscount, global: false, affine: true, segmentLn: logLinearSegmentLn, label: 'Log-linear discount' },
  'cubic-zero': { id: 'cubic-zero', build: interpolatorCubicZero, global: true, affine: true, label: 'Cubic zero (natural)' },
  'monotone-convex': { id: 'monotone-convex', build: interpolatorMonotoneConvex, global: true, locality: 2, segmentLn: monotoneConvexSegmentLn, label: 'Monotone convex' },
  'monotone-convex-positive': {
    id: 'monotone-convex-positive',
    build: interpolatorMonotoneConvexPositive,
    global: true,
    locality: 2,
    segmentLn: monotoneConvexPositiveSegmentLn,
    label: 'Monotone convex (positive)',
  },
};
