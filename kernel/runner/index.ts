export * from './messages.js';
export * from './duration.js';
export * from './parameters.js';
export * from './runNotebook.js';
