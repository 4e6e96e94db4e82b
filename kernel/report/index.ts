export * from './types';
export * from './escape';
export * from './sanitize';
export * from './markdown';
export * from './outputs';
export * from './html';
export * from './chromium';
export * from './pdf';
