export * from './palette.js';
export * from './figure.js';
export * from './histogram.js';
export * from './xyFigure.js';
export * from './eventDisplay.js';
export * from './trackEventDisplay.js';
