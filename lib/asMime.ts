/**
 * The display protocol's key and types, apart from lib/display so that modules lib/display
 * itself uses to show values (tables) can implement it without an import cycle.
 */

/** One output in several representations, keyed by MIME type. */
export type MimeBundle = Record<string, unknown>;

/** The method key by which an object describes its own display. */
export const asMime: unique symbol = Symbol.for('sagitta.asMime');

/** An object that knows how it displays itself. */
export interface Presentable {
  [asMime](): MimeBundle;
}
