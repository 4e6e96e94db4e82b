export * from './messages';
export * from './duration';
export * from './parameters';
export * from './runNotebook';
