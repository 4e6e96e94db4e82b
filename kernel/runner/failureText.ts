/** The runner's words for how a run or a cell ended (one scheme: code cells are "step 1", "step 2", … in order). */

/** A code cell's place in the run, as the report, the executed notebook's counts and messages name it. */
export function stepName(step: number): string {
  return `step ${step}`;
}

export function exitText(code: number | null, signal: NodeJS.Signals | null): string {
  return signal ? `signal ${signal}` : `exit code ${code}`;
}

export function formatLimit(ms: number): string {
  return ms % 3_600_000 === 0 ? `${ms / 3_600_000} h` : ms % 1000 === 0 ? `${ms / 1000} s` : `${ms} ms`;
}

export function firstLine(text: string): string {
  const line = text.split('\n')[0];
  return line.length > 160 ? `${line.slice(0, 157)}…` : line;
}

/** The last line of what a process wrote, as ": line" (or nothing). */
export function lastLine(text: string): string {
  const t = text.trim().split('\n').slice(-1)[0];
  return t ? `: ${t.slice(0, 200)}` : '';
}

export function timeoutOutput(limitMs: number) {
  const limit = formatLimit(limitMs);
  return {
    output_type: 'error' as const,
    ename: 'CellTimeout',
    evalue: `the cell ran longer than the ${limit} limit (--cell-timeout) and its process was stopped`,
    traceback: [`CellTimeout: the cell ran longer than ${limit}; the notebook process was stopped, so the cells after it were not run`],
  };
}

export function exitOutput(code: number | null, signal: NodeJS.Signals | null) {
  return {
    output_type: 'error' as const,
    ename: 'ProcessExit',
    evalue: `the notebook process ended while this cell ran (${exitText(code, signal)})`,
    traceback: [`ProcessExit: the notebook process ended (${exitText(code, signal)}), e.g. by process.exit() or a crash; the cells after it were not run`],
  };
}

export function stoppedOutput(signal: NodeJS.Signals) {
  return {
    output_type: 'error' as const,
    ename: 'RunStopped',
    evalue: `the run was stopped (${signal} to sagitta run) while this cell ran`,
    traceback: [`RunStopped: sagitta run received ${signal}; the notebook process was stopped and the cells after this one were not run`],
  };
}
