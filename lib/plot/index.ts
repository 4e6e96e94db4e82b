// lib/plot: figure specs (plotly JSON, no DOM). Named re-exports only.
export { PALETTE, SERIES_COLOURS, SERIES_MARKERS, SERIES_DASHES, DENSITY_SCALE, seriesStyle, chargeColour, type SeriesStyle } from './palette.js';
export { Figure, PLOTLY_MIME, baseLayout, axisStyle, plainNumbers, type PlotSpec, type PlotTrace } from './figure.js';
export { logAxisRange, legendMargin } from './axisRange.js';
export { histogramFigure, type HistogramOptions } from './histogram.js';
export { xyFigure, type XYSeries, type XYOptions } from './xyFigure.js';
export { spectrumFigure, type SpectrumFigureOptions } from './spectrumFigure.js';
export { histogram2dFigure, type Histogram2DFigureOptions } from './histogram2dFigure.js';
export { EventDisplay, eventDisplay, type DisplayHits, type DisplayTrack, type EventDisplayOptions } from './eventDisplay.js';
export { eventArcs, trackEventDisplay, type EventArcs } from './trackEventDisplay.js';
export { curvatureAlongTrackFigure } from './curvatureAlongTrackFigure.js';
export { momentumRangeFigure, type MomentumRangePoints } from './momentumRangeFigure.js';
