/**
 * Line numbers of the values in a JSON text, keyed by JSON Pointer (RFC 6901: "/sources/1/momentum",
 * with "~" written "~0" and "/" written "~1" inside keys — the form ajv reports). Used to say
 * where in a scenario file a problem sits. The text must be valid JSON (parse it first).
 * @example jsonPointerLines('{\n  "a": [1,\n 2]}').get('/a/1') // 3
 */
export function jsonPointerLines(text: string): Map<string, number> {
  const lines = new Map<string, number>();
  const n = text.length;
  let i = 0;
  let line = 1;
  const space = () => {
    while (i < n) {
      const c = text.charCodeAt(i);
      if (c === 10) line++;
      else if (c !== 32 && c !== 9 && c !== 13) break;
      i++;
    }
  };
  const string = (): string => {
    const start = i;
    i++;
    while (i < n && text[i] !== '"') i += text[i] === '\\' ? 2 : 1;
    i++;
    return JSON.parse(text.slice(start, i)) as string;
  };
  const escape = (key: string) => key.replace(/~/g, '~0').replace(/\//g, '~1');
  const value = (path: string): void => {
    space();
    lines.set(path, line);
    const c = text[i];
    if (c === '{' || c === '[') {
      const close = c === '{' ? '}' : ']';
      i++;
      space();
      if (text[i] === close) { i++; return; }
      for (let k = 0; ; k++) {
        space();
        let child = `${path}/${k}`;
        if (c === '{') {
          child = `${path}/${escape(string())}`;
          space();
          i++; // ':'
        }
        value(child);
        space();
        if (text[i++] !== ',') return;
      }
    }
    if (c === '"') { string(); return; }
    while (i < n && !',]}'.includes(text[i]) && !/\s/.test(text[i])) i++;
  };
  value('');
  return lines;
}

/**
 * Adds "(line N)" after each JSON Pointer that starts a clause of `message` ("…: /a/b: …"),
 * using the nearest enclosing pointer whose line is known (other than the document itself).
 */
export function withLines(message: string, lines: ReadonlyMap<string, number>): string {
  return message.replace(/(^|: |; )(\/[^\s:;()]*)(?=: )/g, (whole, lead: string, pointer: string) => {
    let p = pointer;
    while (p !== '' && !lines.has(p)) p = p.slice(0, p.lastIndexOf('/'));
    // Falling back to the whole document says nothing useful: leave such a pointer bare.
    const line = p === '' ? undefined : lines.get(p);
    return line === undefined ? whole : `${lead}${pointer} (line ${line})`;
  });
}
