export * from './types';
export * from './source';
export * from './validate';
export * from './upgrade';
export * from './read';
export * from './write';
