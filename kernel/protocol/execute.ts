import { msg } from '../../lib/internal.js';
import type { CellHooks, Session } from '../session/types.js';
import type { ExecutionHistory } from './history.js';
import type { Header, Message } from './wire.js';

/** What the execute handler needs from the server. */
export interface ExecuteContext {
  publish(type: string, content: Record<string, unknown>, parent: Partial<Header>): Promise<void>;
  reply(request: Message, type: string, content: Record<string, unknown>, metadata?: Record<string, unknown>): Promise<void>;
  /** Sends input_request on stdin to the front end that sent `request` and resolves with its input_reply. */
  askFrontEnd(request: Message, prompt: string, password: boolean): Promise<string>;
  session(): Promise<Session>;
  readonly history: ExecutionHistory;
  /** The next execution count when the request stores history, else the current one. */
  count(store: boolean): number;
  /** After a failure with stop_on_error: abort the execute requests already received. */
  abortQueued(): Promise<void>;
  /** Tells the control thread which request is running (undefined: none). */
  running(parent: Header | undefined): void;
}

interface ExecuteContent {
  code?: string;
  silent?: boolean;
  store_history?: boolean;
  stop_on_error?: boolean;
  allow_stdin?: boolean;
  user_expressions?: Record<string, unknown>;
}

/** Stream text is batched this long before it is published. */
const STREAM_FLUSH_MS = 30;

/**
 * execute_request (messaging spec, "Execute"): execute_input, the cell's streams, displays,
 * clear_output and result on iopub, input_request on stdin when the front end allows input,
 * user_expressions evaluated after the cell, and the execute_reply.
 */
export async function executeRequest(ctx: ExecuteContext, request: Message): Promise<void> {
  const c = request.content as ExecuteContent;
  const code = c.code ?? '';
  const silent = c.silent === true;
  const storeHistory = silent ? false : c.store_history !== false;
  const count = ctx.count(storeHistory);
  if (storeHistory) ctx.history.add(count, code);
  const parent = request.header;
  const started = new Date().toISOString();
  if (!silent) await ctx.publish('execute_input', { code, execution_count: count }, parent);

  let pending: { name: 'stdout' | 'stderr'; text: string } | undefined;
  let timer: NodeJS.Timeout | undefined;
  const flush = () => {
    if (timer) clearTimeout(timer);
    timer = undefined;
    if (pending) void ctx.publish('stream', { name: pending.name, text: pending.text }, parent);
    pending = undefined;
  };
  const hooks: CellHooks = {
    stream: (name, text) => {
      if (silent) return;
      if (pending && pending.name !== name) flush();
      pending = pending ? { name, text: pending.text + text } : { name, text };
      timer ??= setTimeout(flush, STREAM_FLUSH_MS);
    },
    display: (bundle, options) => {
      if (silent) return;
      flush();
      const transient = options.displayId === undefined ? {} : { display_id: options.displayId };
      const type = options.update && options.displayId !== undefined ? 'update_display_data' : 'display_data';
      void ctx.publish(type, { data: bundle, metadata: {}, transient }, parent);
    },
    clear: (wait) => {
      if (silent) return;
      flush();
      void ctx.publish('clear_output', { wait }, parent);
    },
    ask: (prompt, password) => {
      if (c.allow_stdin !== true) {
        return Promise.reject(msg.inputUnavailable('this front end does not allow input (allow_stdin is false)', 'give the value another way, e.g. as a knob'));
      }
      flush();
      return ctx.askFrontEnd(request, prompt, password);
    },
  };

  const session = await ctx.session();
  ctx.running(parent);
  const outcome = await session.execute(code, hooks, { label: storeHistory ? `cell ${count}` : 'cell' }).finally(() => ctx.running(undefined));
  flush();
  if (outcome.status === 'ok') {
    if (outcome.result && !silent) {
      await ctx.publish('execute_result', { execution_count: count, data: outcome.result, metadata: {} }, parent);
      if (storeHistory && typeof outcome.result['text/plain'] === 'string') ctx.history.setOutput(count, outcome.result['text/plain']);
    }
    const userExpressions = await evaluateUserExpressions(session, c.user_expressions);
    await ctx.reply(request, 'execute_reply', { status: 'ok', execution_count: count, user_expressions: userExpressions, payload: [] }, { started, status: 'ok' });
    return;
  }
  const error = outcome.error ?? { ename: 'Error', evalue: 'the cell failed', traceback: [] };
  if (c.stop_on_error !== false) await ctx.abortQueued();
  if (!silent) await ctx.publish('error', { ename: error.ename, evalue: error.evalue, traceback: error.traceback }, parent);
  await ctx.reply(
    request,
    'execute_reply',
    { status: 'error', execution_count: count, ename: error.ename, evalue: error.evalue, traceback: error.traceback },
    { started, status: 'error' },
  );
}

/**
 * The spec's user_expressions: each expression is evaluated after the cell, quietly, and its
 * value returned as a MIME bundle (or its error), keyed by the client's names.
 */
async function evaluateUserExpressions(session: Session, expressions: Record<string, unknown> | undefined): Promise<Record<string, unknown>> {
  const out: Record<string, unknown> = {};
  const quiet: CellHooks = {
    stream: () => {},
    display: () => {},
    clear: () => {},
    ask: () => Promise.reject(msg.inputUnavailable('user expressions cannot ask for input', 'evaluate the expression in a cell')),
  };
  for (const [name, expression] of Object.entries(expressions ?? {})) {
    const r = await session.execute(String(expression), quiet, { label: `expression ${name}` });
    out[name] =
      r.status === 'ok'
        ? { status: 'ok', data: r.result ?? { 'text/plain': 'undefined' }, metadata: {} }
        : { status: 'error', ename: r.error?.ename ?? 'Error', evalue: r.error?.evalue ?? '', traceback: r.error?.traceback ?? [] };
  }
  return out;
}

/** An execute request queued behind a failed cell: aborted, with no execution count (as front ends expect). */
export async function abortRequest(ctx: Pick<ExecuteContext, 'publish' | 'reply'>, request: Message): Promise<void> {
  await ctx.publish('status', { execution_state: 'busy' }, request.header);
  await ctx.reply(request, 'execute_reply', { status: 'aborted' }, { status: 'aborted' });
  await ctx.publish('status', { execution_state: 'idle' }, request.header);
}
