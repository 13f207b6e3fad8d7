/**
 * Tenorscope's chart styles. Every series that can be drawn has its own colour and its own dash
 * pattern, so no two lines in one chart look alike and none depends on colour alone (a grey print
 * or a colour-vision deficiency still tells them apart by dash).
 *
 * The colours are our own, picked by a greedy search for the largest smallest colour difference
 * (CIELAB delta E) between every pair, seen with normal vision and with simulated protanopia,
 * deuteranopia and tritanopia, among calm mid-to-dark hues that keep 3:1 contrast on white
 * (WCAG 2.1, 1.4.11 non-text contrast). test/charts/palette.test.ts checks all of it.
 */
export interface SeriesStyle {
  readonly colour: string;
  /** SVG stroke-dasharray; '' is a solid line. */
  readonly dash: string;
  readonly width: number;
}

export const PALETTE = {
  zero: '#1d5fa6',
  par: '#c4581d',
  forward: '#187a5e',
  instantaneous: '#672fbc',
  marker: '#c4581d',
  pillar: '#8a8f98',
  grid: '#e4e7ec',
  axis: '#5b6270',
  crosshair: '#30343b',
} as const;

/** The base series: the zero chart's zero and par lines, the forward chart's forward and instantaneous lines. */
export const BASE_STYLES = {
  zero: { colour: PALETTE.zero, dash: '', width: 2 },
  par: { colour: PALETTE.par, dash: '6 3', width: 2 },
  forward: { colour: PALETTE.forward, dash: '', width: 2.2 },
  instantaneous: { colour: PALETTE.instantaneous, dash: '3 3', width: 1.5 },
} as const satisfies Record<string, SeriesStyle>;

/** The method overlay on the forward chart, one style per interpolation method. */
export const METHOD_STYLES: Readonly<Record<string, SeriesStyle>> = {
  'linear-zero': { colour: '#8f693d', dash: '12 4', width: 1.4 },
  'log-linear-discount': { colour: '#1d1d72', dash: '5 2 5 6', width: 1.4 },
  'cubic-zero': { colour: '#642b60', dash: '9 3 2 3', width: 1.4 },
  'monotone-convex': { colour: '#6b2440', dash: '14 3 5 3', width: 1.4 },
  'monotone-convex-positive': { colour: '#993341', dash: '4 2 1 2', width: 1.4 },
};

/** How many scenarios the workbench's charts draw over the base curve; the rest are counted ("N more not drawn"). */
export const SCENARIO_OVERLAY_MAX = 4;

/** The scenario lines (the same style on the zero and the forward chart), in the scenarios' order. */
export const SCENARIO_STYLES: readonly SeriesStyle[] = [
  { colour: '#2fa0bc', dash: '9 3 2 3 2 3', width: 1.6 },
  { colour: '#a49146', dash: '2 2 2 2 8 2', width: 1.6 },
  { colour: '#a44685', dash: '1 2', width: 1.8 },
  { colour: '#721d1d', dash: '6 2 1 2 1 2', width: 1.6 },
];

/** How many snapshots the charts draw as comparisons; more chosen are counted ("N more not drawn"). */
export const SNAPSHOT_OVERLAY_MAX = 3;

/**
 * The comparison lines (the same style on both charts): the chosen snapshots in the snapshots'
 * order, the imported reference curve and the smooth fit. Picked by the same greedy search as the
 * colours above, against every colour above.
 */
export const SNAPSHOT_STYLES: readonly SeriesStyle[] = [
  { colour: '#a078f8', dash: '7 2', width: 1.6 },
  { colour: '#f84880', dash: '2 4', width: 1.8 },
  { colour: '#8088d8', dash: '8 2 2 2 2 2', width: 1.6 },
];
export const REFERENCE_STYLE: SeriesStyle = { colour: '#980800', dash: '3 1 3 5', width: 1.6 };
export const FIT_STYLE: SeriesStyle = { colour: '#7048f8', dash: '10 2 2 2', width: 1.8 };

/** Which styles can share a chart (for the distinctness check): the zero chart and the forward chart. */
export const CHART_GROUPS: Readonly<Record<'zero' | 'forward', readonly SeriesStyle[]>> = {
  zero: [BASE_STYLES.zero, BASE_STYLES.par, ...SCENARIO_STYLES, ...SNAPSHOT_STYLES, REFERENCE_STYLE, FIT_STYLE],
  forward: [BASE_STYLES.forward, BASE_STYLES.instantaneous, ...Object.values(METHOD_STYLES), ...SCENARIO_STYLES, ...SNAPSHOT_STYLES, REFERENCE_STYLE, FIT_STYLE],
};
