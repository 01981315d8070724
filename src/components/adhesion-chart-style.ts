/** Shared by the chart's frame (legend, placeholder) and the lazily loaded drawing. */
export const CHART_HEIGHT = 300;
export const CHART_COLOURS = { front: '#1d4d3a', rear: '#b8892f', ideal: '#5c5a52', line: '#70521a', band: '#dbe7e0' };
