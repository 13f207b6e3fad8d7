import { describe, it, expect } from 'vitest';
import { levenbergMarquardt } from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

// Standard test problems: J. J. More, B. S. Garbow and K. E. Hillstrom, "Testing Unconstrained
// Optimization Software", ACM TOMS 7(1), 1981 (problem definitions, start points and minima cited
// from memory).
describe('levenbergMarquardt on published test problems', () => {
  it('Rosenbrock (problem 1): r = (10 (x2 - x1^2), 1 - x1) from (-1.2, 1) reaches the minimum (1, 1) with sum of squares 0', () => {
    const res = levenbergMarquardt((x, out) => {
      out[0] = 10 * (x[1]! - x[0]! * x[0]!);
      out[1] = 1 - x[0]!;
      return true;
    }, [-1.2, 1], 2);
    expect(res.converged).toBe(true);
    expectClose(res.x[0]!, 1, 1e-10, 'More-Garbow-Hillstrom problem 1, minimiser x1 = 1');
    expectClose(res.x[1]!, 1, 1e-10, 'More-Garbow-Hillstrom problem 1, minimiser x2 = 1');
    expectClose(res.ssr, 0, 1e-20, 'More-Garbow-Hillstrom problem 1, f* = 0');
  });
  it('Freudenstein and Roth (problem 2) from (0.5, -2) stops at one of its two documented minima', () => {
    const res = levenbergMarquardt((x, out) => {
      const [a, b] = [x[0]!, x[1]!];
      out[0] = -13 + a + ((5 - b) * b - 2) * b;
      out[1] = -29 + a + ((b + 1) * b - 14) * b;
      return true;
    }, [0.5, -2], 2);
    expect(res.converged).toBe(true);
    // The problem has f = 0 at (5, 4) and a local minimum f = 48.9842... at (11.41..., -0.8968...).
    if (res.ssr < 1) {
      expectClose(res.x[0]!, 5, 1e-8, 'More-Garbow-Hillstrom problem 2, global minimiser (5, 4)');
    } else {
      expectClose(res.ssr, 48.9842, 1e-4, 'More-Garbow-Hillstrom problem 2, local minimum f = 48.9842...');
      expectClose(res.x[1]!, -0.8968, 1e-4, 'More-Garbow-Hillstrom problem 2, local minimiser x2 = -0.8968...');
    }
  });
  it('respects a bound by projection: min (x - 3)^2 with x <= 2 stops at 2', () => {
    const res = levenbergMarquardt((x, out) => ((out[0] = x[0]! - 3), true), [0], 1, { project: (x) => void (x[0] = Math.min(x[0]!, 2)) });
    expect(res.converged).toBe(true);
    expectClose(res.x[0]!, 2, 1e-12, 'the constrained minimiser is the bound');
  });
  it('reports a residual that is not finite instead of returning a NaN fit', () => {
    const res = levenbergMarquardt((_x, out) => ((out[0] = Number.NaN), false), [1], 1);
    expect(res.converged).toBe(false);
    expect(res.reason).toBe('non-finite');
  });
});
