import type { MultilineString } from './types.js';

/** Joins a multiline string field (a string or a list of lines with their newlines) into one string. */
export function joinSource(text: MultilineString): string {
  return Array.isArray(text) ? text.join('') : text;
}

/** Splits text into the list-of-lines form nbformat writers use (each line keeps its '\n'). */
export function splitLines(text: string): string[] {
  if (text === '') return [];
  const lines = text.split(/(?<=\n)/);
  return lines;
}
