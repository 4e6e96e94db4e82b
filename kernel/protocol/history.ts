/**
 * The kernel's execution history, answering history_request (messaging spec, "History"): the
 * cells run with store_history, as (session, line, input) — or (session, line, (input, output))
 * when the request asks for output, the output being the text form of the cell's result (null
 * when it had none). A kernel process is session 1; lines are execution counts.
 */
export type HistoryEntry = [number, number, string] | [number, number, [string, string | null]];

interface Line {
  readonly line: number;
  readonly input: string;
  output: string | null;
}

const SESSION = 1;

export class ExecutionHistory {
  private readonly lines: Line[] = [];

  /** Records a stored execution. */
  add(line: number, input: string): void {
    this.lines.push({ line, input, output: null });
  }

  /** Records the text form of the result of execution `line`. */
  setOutput(line: number, output: string): void {
    const entry = this.lines.find((l) => l.line === line);
    if (entry) entry.output = output;
  }

  /** history_request: 'tail' (last n), 'range' (start ≤ line < stop) or 'search' (glob pattern, * and ?, optionally unique). */
  query(content: Record<string, unknown>): HistoryEntry[] {
    const n = typeof content.n === 'number' ? content.n : this.lines.length;
    let found: Line[];
    switch (content.hist_access_type) {
      case 'range': {
        const start = typeof content.start === 'number' ? content.start : 0;
        const stop = typeof content.stop === 'number' ? content.stop : Infinity;
        // Session 0 and 1 both mean this process; a negative session counts back, and there is no earlier one.
        const session = typeof content.session === 'number' ? content.session : 0;
        found = session === 0 || session === SESSION ? this.lines.filter((l) => l.line >= start && l.line < stop) : [];
        break;
      }
      case 'search': {
        const re = globToRegExp(String(content.pattern ?? '*'));
        found = this.lines.filter((l) => re.test(l.input));
        if (content.unique === true) found = found.filter((l, i) => found.findIndex((other) => other.input === l.input) === i);
        found = found.slice(-n);
        break;
      }
      default:
        found = this.lines.slice(-n);
    }
    return content.output === true
      ? found.map((l): HistoryEntry => [SESSION, l.line, [l.input, l.output]])
      : found.map((l): HistoryEntry => [SESSION, l.line, l.input]);
  }
}

/** A shell-style glob (`*` any run, `?` one character) as an anchored regular expression. */
export function globToRegExp(glob: string): RegExp {
  const body = [...glob]
    .map((ch) => (ch === '*' ? '[\\s\\S]*' : ch === '?' ? '[\\s\\S]' : ch.replace(/[.+^${}()|[\]\\]/g, (c) => `\\${c}`)))
    .join('');
  return new RegExp(`^${body}$`);
}
