import { fileURLToPath } from 'node:url';

/** One case of the bad-input catalogue (test/fixtures/bad/cases.json). */
export interface BadCase {
  readonly name: string;
  /** Arguments after `sagitta`, run in a fresh folder holding copies of `files`. */
  readonly args: readonly string[];
  /** Files of test/fixtures/bad/inputs/ copied into the folder first. */
  readonly files?: readonly string[];
  readonly setup?: readonly {
    readonly mkdir?: string;
    readonly write?: { readonly path: string; readonly text: string };
    readonly symlink?: { readonly target: string; readonly path: string };
    readonly hardlink?: { readonly target: string; readonly path: string };
    /** A file of test/fixtures/bad/inputs/ copied under another name. */
    readonly copy?: { readonly from: string; readonly to: string };
  }[];
  /** Expected exit code: 1 an input is unusable, 2 the command line is wrong. */
  readonly exit: number;
  /** The exact message on stderr (the folder of the case written as <dir>). */
  readonly stderr: string;
  /** What the case is about (the fault it guards against). */
  readonly why: string;
}

export interface BadCaseResult {
  readonly name: string;
  readonly exit: number;
  readonly stdout: string;
  readonly stderr: string;
  /** Files of the case's folder that were changed, removed or added. */
  readonly changed: readonly string[];
}

export const BAD_CASES_FILE = fileURLToPath(new URL('../fixtures/bad/cases.json', import.meta.url));
export const BAD_INPUTS_DIR = fileURLToPath(new URL('../fixtures/bad/inputs/', import.meta.url));
export const BAD_RUNNER = fileURLToPath(new URL('./badInputRunner.ts', import.meta.url));
