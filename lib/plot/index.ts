export * from './display';
export * from './palette';
export * from './figure';
export * from './histogram';
export * from './xyFigure';
export * from './eventDisplay';
export * from './trackEventDisplay';
