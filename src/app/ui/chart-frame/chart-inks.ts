// A canvas cannot read CSS custom properties: the charts' colours are tones of our palette
// (_theme-colors.scss), each 6.4:1 or more on white, written out here once for every chart.

/** The figures of a chart over days: blue. */
export const CHART_INK = '#1f5fa8';
/** A limit drawn beside the figures: the error red of our palette. */
export const CHART_LIMIT_INK = '#ba1a1a';
/** The grid lines. */
export const CHART_GRID = '#e8e0da';
