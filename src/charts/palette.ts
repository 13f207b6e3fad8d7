/**
 * Tenorscope's line colours, chosen to stay apart for the common colour-vision deficiencies
 * (hues spread between blue and orange, with different lightness), and dash patterns so no line
 * depends on colour alone.
 */
export const PALETTE = {
  zero: '#1d5fa6',
  par: '#c4581d',
  forward: '#187a5e',
  instantaneous: '#7a4f9e',
  marker: '#c4581d',
  pillar: '#8a8f98',
  grid: '#e4e7ec',
  axis: '#5b6270',
  crosshair: '#30343b',
} as const;

/** Colours of the method overlay, one per interpolation method. */
export const METHOD_COLOURS: Readonly<Record<string, string>> = {
  'linear-zero': '#d69a00',
  'log-linear-discount': '#4d9de0',
  'cubic-zero': '#b04a7c',
  'monotone-convex': '#187a5e',
  'monotone-convex-positive': '#5a5f68',
};
export const METHOD_DASH: Readonly<Record<string, string>> = {
  'linear-zero': '6 3',
  'log-linear-discount': '2 3',
  'cubic-zero': '9 3 2 3',
  'monotone-convex': '',
  'monotone-convex-positive': '4 2 1 2',
};
