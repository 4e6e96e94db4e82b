// lib/plot: everything this room offers the other rooms, by name (the public subset is in lib/index.ts).
export { legendMargin, logAxisRange } from './axisRange.js';
export { EventDisplay, eventDisplay, type DisplayHits, type DisplayTrack, type EventDisplayOptions } from './eventDisplay.js';
export { Figure, PLOTLY_MIME, axisStyle, baseLayout, plainNumbers, type PlotSpec, type PlotTrace } from './figure.js';
export { histogramFigure, type HistogramOptions } from './histogram.js';
export { histogram2dFigure, type Histogram2DFigureOptions } from './histogram2dFigure.js';
export { DENSITY_SCALE, PALETTE, SERIES_COLOURS, SERIES_DASHES, SERIES_MARKERS, chargeColour, seriesStyle, type SeriesStyle } from './palette.js';
export { spectrumFigure, type SpectrumFigureOptions } from './spectrumFigure.js';
export { eventArcs, trackEventDisplay, type EventArcs } from './trackEventDisplay.js';
export { xyFigure, type XYOptions, type XYSeries } from './xyFigure.js';
