import { describe, expect, it } from 'vitest';
import { BASE_STYLES, CHART_GROUPS, FIT_STYLE, METHOD_STYLES, REFERENCE_STYLE, SCENARIO_OVERLAY_MAX, SCENARIO_STYLES, SNAPSHOT_OVERLAY_MAX, SNAPSHOT_STYLES, type SeriesStyle } from '../../src/charts/palette.ts';
import { INTERPOLATIONS } from '../../src/core/index.ts';

// Colour arithmetic for the checks below.
// - sRGB to linear and relative luminance, contrast ratio: WCAG 2.1, "relative luminance" and
//   "contrast ratio" definitions (W3C Recommendation).
// - sRGB (D65) to XYZ matrix and CIELAB: IEC 61966-2-1 and CIE 15 (CIE 1976 L*a*b*).
// - Colour-vision deficiency simulation: Machado, Oliveira and Fernandes (2009), "A Physiologically-
//   based Model for Simulation of Color Vision Deficiency", IEEE TVCG 15(6), severity 1.0 matrices
//   applied to linear RGB. The matrix entries are written from memory; the sanity checks below
//   (pure red and green nearly merge for protanopes and deuteranopes, blue and green stay apart
//   for them, and so on) would catch a wrong one.
type Rgb = readonly [number, number, number];
const hex = (h: string): Rgb => [1, 3, 5].map((i) => parseInt(h.slice(i, i + 2), 16) / 255) as unknown as Rgb;
const toLinear = (c: number): number => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4);
const luminance = (h: string): number => {
  const [r, g, b] = hex(h).map(toLinear) as unknown as Rgb;
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
};
const contrastOnWhite = (h: string): number => 1.05 / (luminance(h) + 0.05);

type M3 = readonly [Rgb, Rgb, Rgb];
const apply = (m: M3, v: Rgb): Rgb => m.map((row) => Math.min(1, Math.max(0, row[0] * v[0] + row[1] * v[1] + row[2] * v[2]))) as unknown as Rgb;
const IDENTITY: M3 = [[1, 0, 0], [0, 1, 0], [0, 0, 1]];
const PROTANOPIA: M3 = [[0.152286, 1.052583, -0.204868], [0.114503, 0.786281, 0.099216], [-0.003882, -0.048116, 1.051998]];
const DEUTERANOPIA: M3 = [[0.367322, 0.860646, -0.227968], [0.280085, 0.672501, 0.047413], [-0.01182, 0.04294, 0.968881]];
const TRITANOPIA: M3 = [[1.255528, -0.076749, -0.178779], [-0.078411, 0.930809, 0.147602], [0.004733, 0.691367, 0.3039]];
const VISIONS = { normal: IDENTITY, protanopia: PROTANOPIA, deuteranopia: DEUTERANOPIA, tritanopia: TRITANOPIA } as const;

const lab = (lin: Rgb): Rgb => {
  const x = (0.4124 * lin[0] + 0.3576 * lin[1] + 0.1805 * lin[2]) / 0.95047;
  const y = 0.2126 * lin[0] + 0.7152 * lin[1] + 0.0722 * lin[2];
  const z = (0.0193 * lin[0] + 0.1192 * lin[1] + 0.9505 * lin[2]) / 1.08883;
  const f = (t: number): number => (t > (6 / 29) ** 3 ? Math.cbrt(t) : t / (3 * (6 / 29) ** 2) + 4 / 29);
  return [116 * f(y) - 16, 500 * (f(x) - f(y)), 200 * (f(y) - f(z))];
};
/** CIE 1976 delta E between two colours as seen with the given vision. */
const deltaE = (a: string, b: string, m: M3): number => {
  const la = lab(apply(m, hex(a).map(toLinear) as unknown as Rgb));
  const lb = lab(apply(m, hex(b).map(toLinear) as unknown as Rgb));
  return Math.hypot(la[0] - lb[0], la[1] - lb[1], la[2] - lb[2]);
};

const pairs = <T,>(xs: readonly T[]): [T, T][] => xs.flatMap((a, i) => xs.slice(i + 1).map((b) => [a, b] as [T, T]));
const COMPARISONS: readonly SeriesStyle[] = [...SNAPSHOT_STYLES, REFERENCE_STYLE, FIT_STYLE];
const ALL: readonly SeriesStyle[] = [...Object.values(BASE_STYLES), ...Object.values(METHOD_STYLES), ...SCENARIO_STYLES, ...COMPARISONS];
const show = (s: SeriesStyle): string => `${s.colour} "${s.dash}"`;

describe('chart series styles (src/charts/palette.ts)', () => {
  it('colour arithmetic agrees with published values (sanity of the helpers)', () => {
    // WebAIM contrast checker / WCAG examples: #767676 on white is 4.54:1, black on white 21:1 (from memory).
    expect(contrastOnWhite('#767676')).toBeCloseTo(4.54, 2);
    expect(contrastOnWhite('#000000')).toBeCloseTo(21, 6);
    // Pure red and pure green nearly merge for protanopes and deuteranopes but not for tritanopes;
    // blue and yellow merge for nobody of the three red-green kinds.
    expect(deltaE('#ff0000', '#00ff00', IDENTITY)).toBeGreaterThan(100);
    expect(deltaE('#ff0000', '#00ff00', DEUTERANOPIA)).toBeLessThan(deltaE('#ff0000', '#00ff00', TRITANOPIA) / 3);
    expect(deltaE('#ff0000', '#00ff00', PROTANOPIA)).toBeLessThan(deltaE('#ff0000', '#00ff00', TRITANOPIA) / 2);
    expect(deltaE('#0000ff', '#ffff00', DEUTERANOPIA)).toBeGreaterThan(100);
  });

  it('gives every interpolation method an overlay style and every drawn scenario its own style', () => {
    for (const m of INTERPOLATIONS) expect(METHOD_STYLES[m], m).toBeDefined();
    expect(SCENARIO_STYLES.length).toBe(SCENARIO_OVERLAY_MAX);
  });

  it('gives every drawn snapshot, the reference curve and the smooth fit a style that can share both charts', () => {
    expect(SNAPSHOT_STYLES.length).toBe(SNAPSHOT_OVERLAY_MAX);
    for (const s of COMPARISONS) {
      expect(CHART_GROUPS.zero, show(s)).toContain(s);
      expect(CHART_GROUPS.forward, show(s)).toContain(s);
    }
  });

  it('gives every series its own colour (all charts together)', () => {
    const colours = ALL.map((s) => s.colour.toLowerCase());
    expect(new Set(colours).size).toBe(colours.length);
  });

  for (const [chart, styles] of Object.entries(CHART_GROUPS)) {
    it(`keeps every pair of series that can share the ${chart} chart apart in colour and in dash`, () => {
      for (const [a, b] of pairs(styles)) {
        expect(a.colour.toLowerCase(), `${show(a)} vs ${show(b)}`).not.toBe(b.colour.toLowerCase());
        expect(a.dash.replace(/\s+/g, ' ').trim(), `${show(a)} vs ${show(b)}`).not.toBe(b.dash.replace(/\s+/g, ' ').trim());
      }
    });

    it(`keeps the ${chart} chart's colours apart for normal vision and for protanopia, deuteranopia and tritanopia (delta E 12 or more)`, () => {
      for (const [vision, m] of Object.entries(VISIONS)) {
        for (const [a, b] of pairs(styles)) expect(deltaE(a.colour, b.colour, m), `${vision}: ${a.colour} vs ${b.colour}`).toBeGreaterThanOrEqual(12);
      }
    });
  }

  it('draws every series with at least 3:1 contrast on white (WCAG 2.1, 1.4.11 non-text contrast)', () => {
    for (const s of ALL) expect(contrastOnWhite(s.colour), s.colour).toBeGreaterThanOrEqual(3);
  });
});
