export * from './types.js';
export * from './source.js';
export * from './validate.js';
export * from './upgrade.js';
export * from './read.js';
export * from './write.js';
