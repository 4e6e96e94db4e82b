/**
 * Target size of a chunk of a text hit file, and the unit of the thread count's cap (a file of k
 * chunks uses at most k threads). Fixed, not tied to the thread count, though results do not
 * depend on it. Its own module, so the early start of worker threads can read it without loading
 * the library.
 */
export const CHUNK_BYTES = 4 << 20;
