/**
 * Drives the installed kernel over zeromq with the test suite's own client (protocol-client.ts),
 * as a front end would: install the kernelspec into a temporary folder, start kernel.json's argv
 * with a connection file, and check the replies and iopub traffic against the messaging
 * specification (Jupyter messaging protocol 5.3; the client is written from the spec, not from
 * kernel/protocol).
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ProtocolClient, readKernelJson, withTimeout, type WireMessage } from './protocol-client.js';

const root = path.resolve(__dirname, '../..');
const kernelsDir = mkdtempSync(path.join(tmpdir(), 'sagitta-kernels-'));
const notebookDir = mkdtempSync(path.join(tmpdir(), 'sagitta-notebook-'));
const client = new ProtocolClient();
let kernelInfo: WireMessage;

function types(msgs: WireMessage[]): string[] {
  return msgs.map((m) => m.header.msg_type);
}

async function run(code: string, extra: Record<string, unknown> = {}) {
  return client.request('shell', 'execute_request', { code, silent: false, store_history: true, user_expressions: {}, allow_stdin: false, stop_on_error: true, ...extra }, 120_000);
}

beforeAll(async () => {
  execFileSync(process.execPath, [path.join(root, 'kernel/bin/sagitta.js'), 'kernel', 'install', '--dir', kernelsDir, '--id', 'sagitta-test'], { cwd: root });
  // A module next to the notebook, imported by relative path from a cell.
  writeFileSync(path.join(notebookDir, 'local.ts'), 'export function doubled(x: number): number { return 2 * x; }\n');
  const spec = readKernelJson(path.join(kernelsDir, 'sagitta-test'));
  await client.launch(spec.argv, notebookDir);
  kernelInfo = await client.handshake(60_000);
}, 120_000);

afterAll(async () => {
  client.close();
  rmSync(kernelsDir, { recursive: true, force: true });
  rmSync(notebookDir, { recursive: true, force: true });
});

describe('sagitta kernel over zeromq (messaging protocol 5.3)', { timeout: 120_000 }, () => {
  it('kernel_info_reply states protocol 5.3 and the true TypeScript, Node and Sagitta versions', () => {
    const c = kernelInfo.content;
    expect(kernelInfo.header.msg_type).toBe('kernel_info_reply');
    expect(c.status).toBe('ok');
    expect(c.protocol_version).toBe('5.3');
    expect(c.language_info.name).toBe('typescript');
    expect(c.language_info.file_extension).toBe('.ts');
    // The compiler that checks cells is tslab's bundled TypeScript; read its version independently.
    const fromTslab = createRequire(createRequire(path.join(root, 'package.json')).resolve('tslab/package.json'));
    const tsVersion = JSON.parse(readFileSync(fromTslab.resolve('@tslab/typescript-for-tslab/package.json'), 'utf8')).version;
    expect(c.language_info.version).toBe(tsVersion);
    expect(c.implementation_version).toBe(JSON.parse(readFileSync(path.join(root, 'package.json'), 'utf8')).version);
    expect(c.banner).toContain(`Node.js ${process.versions.node}`);
  });

  it('kernel.json as installed: language typescript, signal interrupt mode, argv with {connection_file}', () => {
    const spec = readKernelJson(path.join(kernelsDir, 'sagitta-test'));
    expect(spec.language).toBe('typescript');
    expect(spec.interrupt_mode).toBe('signal');
    expect(spec.argv).toContain('{connection_file}');
  });

  it('heartbeat echoes what it is sent', async () => {
    expect(await client.ping('lub-dub')).toBe('lub-dub');
  });

  it('execute: execute_input, stream (stdout and stderr), display_data, update_display_data and execute_result, between busy and idle', async () => {
    const { reply, iopub } = await run(
      [
        'import { PROTON, present, refresh } from "sagitta-tracks";',
        'import { doubled } from "./local";',
        'console.log("to stdout");',
        'console.error("to stderr");',
        'present("first", { id: "progress" });',
        'refresh("progress", "second");',
        'doubled(PROTON.massMeV)',
      ].join('\n'),
    );
    expect(reply.content.status).toBe('ok');
    const kinds = types(iopub);
    expect(kinds[0]).toBe('status');
    expect(iopub[0].content.execution_state).toBe('busy');
    expect(kinds.at(-1)).toBe('status');
    expect(iopub.at(-1)!.content.execution_state).toBe('idle');
    expect(kinds).toEqual(expect.arrayContaining(['execute_input', 'stream', 'display_data', 'update_display_data', 'execute_result']));
    const input = iopub.find((m) => m.header.msg_type === 'execute_input')!;
    expect(input.content.execution_count).toBe(reply.content.execution_count);
    const streams = iopub.filter((m) => m.header.msg_type === 'stream');
    expect(streams.find((m) => m.content.name === 'stdout')!.content.text).toContain('to stdout');
    expect(streams.find((m) => m.content.name === 'stderr')!.content.text).toContain('to stderr');
    const shown = iopub.find((m) => m.header.msg_type === 'display_data')!;
    expect(shown.content.data['text/plain']).toBe('first');
    expect(shown.content.transient.display_id).toBe('progress');
    const updated = iopub.find((m) => m.header.msg_type === 'update_display_data')!;
    expect(updated.content.data['text/plain']).toBe('second');
    expect(updated.content.transient.display_id).toBe('progress');
    // Proton mass 938.27208816 MeV/c² (CODATA 2018, as the library's particle table quotes it), doubled.
    const result = iopub.find((m) => m.header.msg_type === 'execute_result')!;
    expect(Number(result.content.data['text/plain'])).toBeCloseTo(2 * 938.27208816, 8);
    expect(result.content.execution_count).toBe(reply.content.execution_count);
  });

  it('a figure shows as application/vnd.plotly.v1+json with text/html and text/plain fallbacks', async () => {
    const { reply, iopub } = await run('import { histogramFigure } from "sagitta-tracks";\nhistogramFigure([1, 2, 2, 3, 3, 3], { bins: 3 })');
    expect(reply.content.status).toBe('ok');
    const data = iopub.find((m) => m.header.msg_type === 'execute_result')!.content.data;
    expect(data['application/vnd.plotly.v1+json']).toHaveProperty('data');
    expect(typeof data['text/html']).toBe('string');
    expect(typeof data['text/plain']).toBe('string');
  });

  it('an event display shows as image/svg+xml, shown mid-cell with present()', async () => {
    const { reply, iopub } = await run(
      [
        'import { eventDisplay, present } from "sagitta-tracks";',
        'const xs = [0, 0.1, 0.2, 0.3], ys = xs.map((x) => 2 - Math.sqrt(4 - x * x));',
        'present(eventDisplay({ xM: xs, yM: ys, track: [0, 0, 0, 0] }, [{ centerXM: 0, centerYM: 2, radiusM: 2, charge: 1 }], { fieldT: 1.5 }));',
      ].join('\n'),
    );
    expect(reply.content.status).toBe('ok');
    const shown = iopub.find((m) => m.header.msg_type === 'display_data')!;
    expect(String(shown.content.data['image/svg+xml'])).toMatch(/^<svg/);
    expect(typeof shown.content.data['text/plain']).toBe('string');
  });

  it('a danfojs DataFrame shows as an HTML table plus text', async () => {
    const { reply, iopub } = await run('import * as dfd from "danfojs-node";\nnew dfd.DataFrame({ track: [1, 2], pGeV: [0.95, 1.31] })');
    expect(reply.content.status).toBe('ok');
    const data = iopub.find((m) => m.header.msg_type === 'execute_result')!.content.data;
    expect(String(data['text/html'])).toMatch(/^<table/);
    expect(String(data['text/plain'])).toContain('pGeV');
  });

  it('user_expressions are evaluated after the cell and returned in the reply as MIME bundles', async () => {
    const { reply, iopub } = await run('const fieldT = 1.5;', { user_expressions: { field: 'fieldT * 10', broken: 'notDefinedAnywhere' } });
    expect(reply.content.user_expressions.field).toEqual({ status: 'ok', data: { 'text/plain': '15' }, metadata: {} });
    expect(reply.content.user_expressions.broken.status).toBe('error');
    expect(types(iopub)).not.toContain('execute_result');
  });

  it('silent execution publishes no execute_input and no result and leaves the counter alone', async () => {
    const before = (await run('"count"')).reply.content.execution_count;
    const { reply, iopub } = await run('console.log("quiet"); 42', { silent: true, store_history: false });
    expect(reply.content.status).toBe('ok');
    expect(types(iopub).filter((t) => t !== 'status')).toEqual([]);
    expect((await run('"next"')).reply.content.execution_count).toBe(before + 1);
  });

  it('an error cell publishes error and replies status error with ename, evalue and traceback', async () => {
    const { reply, iopub } = await run('function deep(): never { throw new RangeError("field map ends at 2 m"); }\ndeep();');
    expect(reply.content.status).toBe('error');
    expect(reply.content.ename).toBe('RangeError');
    expect(reply.content.evalue).toBe('field map ends at 2 m');
    expect(Array.isArray(reply.content.traceback)).toBe(true);
    const err = iopub.find((m) => m.header.msg_type === 'error')!;
    expect(err.content).toMatchObject({ ename: 'RangeError', evalue: 'field map ends at 2 m' });
  });

  it('a type error is reported as an error without running the cell', async () => {
    const { reply } = await run('const label: string = 42;\nconsole.log("must not print");');
    expect(reply.content.status).toBe('error');
    expect(reply.content.ename).toBe('CompileError');
    expect(reply.content.evalue).toMatch(/not assignable/);
  });

  it('stop_on_error aborts the execute requests queued behind a failing cell; stop_on_error=false does not', async () => {
    const failing = await client.send('shell', 'execute_request', { code: 'throw new Error("first fails")', stop_on_error: true });
    const queued = await client.send('shell', 'execute_request', { code: '"never runs"' });
    expect((await withTimeout(failing.reply, 60_000, 'reply')).content.status).toBe('error');
    const aborted = await withTimeout(queued.reply, 60_000, 'reply');
    expect(aborted.content).toEqual({ status: 'aborted' }); // no execution_count: front ends would label the skipped cell with it
    const tolerant = await client.send('shell', 'execute_request', { code: 'throw new Error("fails quietly")', stop_on_error: false });
    const after = await client.send('shell', 'execute_request', { code: '"runs anyway"' });
    expect((await withTimeout(tolerant.reply, 60_000, 'reply')).content.status).toBe('error');
    expect((await withTimeout(after.reply, 60_000, 'reply')).content.status).toBe('ok');
  });

  it('a message with a bad signature is dropped (no reply, no status) and logged; the kernel keeps serving', async () => {
    const before = client.published.length;
    const bad = await client.send('shell', 'execute_request', { code: 'console.log("forged")' }, true);
    await expect(withTimeout(bad.reply, 1500, 'reply to a forged message')).rejects.toThrow(/timed out/);
    expect(client.published.slice(before).some((m) => m.parent_header.msg_id === bad.id)).toBe(false);
    expect(client.stderr).toMatch(/bad signature/);
    const { reply } = await run('1 + 1');
    expect(reply.content.status).toBe('ok');
  });

  it('is_complete: complete, incomplete (open block) and invalid', async () => {
    const ask = async (code: string) => (await client.request('shell', 'is_complete_request', { code })).reply.content;
    expect((await ask('const p = 1.5 * 0.3;')).status).toBe('complete');
    const open = await ask('for (let i = 0; i < 3; i++) {');
    expect(open.status).toBe('incomplete');
    expect(open.indent).toBe('  ');
    expect((await ask('let x = 1 +* ;)')).status).toBe('invalid');
  });

  it('complete: matches with cursor positions in code points (a character outside the BMP before the cursor)', async () => {
    const code = 'const 𝜎 = 0.2;\nMath.ma';
    const cursor = [...code].length; // code points; 𝜎 is one code point but two UTF-16 units
    const { reply } = await client.request('shell', 'complete_request', { code, cursor_pos: cursor });
    expect(reply.content.status).toBe('ok');
    expect(reply.content.matches).toContain('max');
    expect(reply.content.cursor_end).toBe(cursor);
    expect(reply.content.cursor_start).toBe(cursor - 2);
  });

  it('inspect: the signature and doc comment of a library function', async () => {
    const code = 'import { particle } from "sagitta-tracks";\nparticle';
    const { reply } = await client.request('shell', 'inspect_request', { code, cursor_pos: [...code].length, detail_level: 0 });
    expect(reply.content.status).toBe('ok');
    expect(reply.content.found).toBe(true);
    expect(reply.content.data['text/plain']).toMatch(/particle\(name: string\)/);
  });

  it('history: tail, range and search over the cells run so far', async () => {
    await run('const historyMarker = "kinks";');
    const tail = (await client.request('shell', 'history_request', { output: false, raw: true, hist_access_type: 'tail', n: 1 })).reply.content;
    expect(tail.status).toBe('ok');
    expect(tail.history).toHaveLength(1);
    expect(tail.history[0][2]).toBe('const historyMarker = "kinks";');
    const found = (await client.request('shell', 'history_request', { output: false, raw: true, hist_access_type: 'search', pattern: '*historyMarker*', n: 10 })).reply.content;
    expect(found.history.map((h: unknown[]) => h[2])).toEqual(['const historyMarker = "kinks";']);
    const line = tail.history[0][1] as number;
    const range = (await client.request('shell', 'history_request', { output: false, raw: true, hist_access_type: 'range', session: 0, start: line, stop: line + 1 })).reply.content;
    expect(range.history).toEqual(tail.history);
  });

  it('history with output=True gives (session, line, (input, output)), the output being the result text or null', async () => {
    const { reply: r1 } = await run('const outputMarker = 6;\noutputMarker * 7');
    await run('const quietMarker = 1;');
    const tail = (await client.request('shell', 'history_request', { output: true, raw: true, hist_access_type: 'tail', n: 2 })).reply.content;
    expect(tail.history).toEqual([[1, r1.content.execution_count, ['const outputMarker = 6;\noutputMarker * 7', '42']], [1, r1.content.execution_count + 1, ['const quietMarker = 1;', null]]]);
  });

  it('clearOutput publishes clear_output (with wait); ask sends input_request on stdin when the front end allows input, and refuses when it does not', async () => {
    client.answerInput = (prompt) => `typed after ${prompt}`;
    const { reply, iopub } = await run('import { ask, clearOutput } from "sagitta-tracks";\nconsole.log("old");\nclearOutput({ wait: true });\nawait ask("Run label? ")', { allow_stdin: true });
    expect(reply.content.status).toBe('ok');
    expect(iopub.find((m) => m.header.msg_type === 'clear_output')!.content).toEqual({ wait: true });
    const asked = client.inputRequests.at(-1)!;
    expect(asked.content).toEqual({ prompt: 'Run label? ', password: false });
    expect(asked.parent_header.msg_id).toBe(reply.parent_header.msg_id);
    expect(iopub.find((m) => m.header.msg_type === 'execute_result')!.content.data['text/plain']).toBe('typed after Run label? ');
    const refused = await run('await ask("again? ")', { allow_stdin: false });
    expect(refused.reply.content.evalue).toMatch(/^a cell asked for input, but this front end does not allow input/);
  });

  it('a run-time error points at the line and column in the cell', async () => {
    const { reply } = await run('const a = 1;\nfunction fail(): never {\n  throw new Error("here");\n}\nfail();');
    expect(reply.content.traceback[1]).toBe(`    at fail (cell ${reply.content.execution_count}, line 3, column 9)`);
  });

  it('comm_info answers with no comms', async () => {
    const { reply } = await client.request('shell', 'comm_info_request', {});
    expect(reply.content).toEqual({ status: 'ok', comms: {} });
  });

  it('interrupt (signal mode) stops a cell that blocks the event loop; the kernel stays usable', async () => {
    const long = await client.send('shell', 'execute_request', { code: 'let spins = 0;\nwhile (true) { spins++; }' });
    await client.waitFor((m) => m.parent_header.msg_id === long.id && m.header.msg_type === 'execute_input', 60_000);
    // A SIGINT that lands while the cell is still being compiled is spent before the loop starts
    // (the loop only becomes breakable once it runs), so signal again until the reply comes, as a
    // user presses interrupt again.
    let replied = false;
    const reply = long.reply.finally(() => (replied = true));
    for (let i = 0; i < 30 && !replied; i++) {
      await new Promise((r) => setTimeout(r, 1000));
      if (!replied) client.kernel!.kill('SIGINT');
    }
    await withTimeout(reply, 5_000, 'reply of the interrupted cell');
    expect((await reply).content.status).toBe('error');
    expect((await reply).content.ename).toBe('Interrupted');
    // The interrupted cell's declarations never completed; the kernel itself carries on.
    expect((await run('"still here"')).iopub.find((m) => m.header.msg_type === 'execute_result')!.content.data['text/plain']).toBe('still here');
  });

  it('interrupt_request on the control channel stops a cell waiting on an await', async () => {
    const long = await client.send('shell', 'execute_request', { code: 'await new Promise((resolve) => setTimeout(resolve, 600_000));' });
    await client.waitFor((m) => m.parent_header.msg_id === long.id && m.header.msg_type === 'execute_input', 60_000);
    await new Promise((r) => setTimeout(r, 300));
    const { reply } = await client.request('control', 'interrupt_request', {});
    expect(reply.content.status).toBe('ok');
    const cell = await withTimeout(long.reply, 30_000, 'reply of the interrupted cell');
    expect(cell.content.status).toBe('error');
    expect(cell.content.ename).toBe('Interrupted');
  });

  it('while a cell blocks the event loop, the heartbeat still answers and interrupt_request (message mode) stops it', async () => {
    const long = await client.send('shell', 'execute_request', { code: 'let laps = 0;\nwhile (true) { laps++; }' });
    await client.waitFor((m) => m.parent_header.msg_id === long.id && m.header.msg_type === 'execute_input', 60_000);
    await new Promise((r) => setTimeout(r, 1000));
    expect(await client.ping('still alive')).toBe('still alive');
    // One request suffices: the kernel repeats the signal until the cell has stopped.
    const ask = await client.send('control', 'interrupt_request', {});
    const reply = await withTimeout(long.reply, 15_000, 'reply of the interrupted cell');
    expect(reply.content.ename).toBe('Interrupted');
    expect((await withTimeout(ask.reply, 10_000, 'interrupt_reply')).content.status).toBe('ok');
    expect((await run('"next cell runs"')).reply.content.status).toBe('ok');
  });

  it('an interrupt_request sent as the cell starts compiling still stops it once its loop runs', async () => {
    const long = await client.send('shell', 'execute_request', { code: 'let rounds = 0;\nwhile (true) { rounds++; }' });
    await client.waitFor((m) => m.parent_header.msg_id === long.id && m.header.msg_type === 'execute_input', 60_000);
    await client.send('control', 'interrupt_request', {});
    expect((await withTimeout(long.reply, 15_000, 'reply of the interrupted cell')).content.ename).toBe('Interrupted');
  });

  it('interrupt_request stops a synchronous loop that starts after an await (stopped from the control thread)', async () => {
    const long = await client.send('shell', 'execute_request', { code: 'await new Promise((r) => setTimeout(r, 50));\nlet turns = 0;\nwhile (true) { turns++; }' });
    await client.waitFor((m) => m.parent_header.msg_id === long.id && m.header.msg_type === 'execute_input', 60_000);
    await new Promise((r) => setTimeout(r, 1500));
    await client.send('control', 'interrupt_request', {});
    const reply = await withTimeout(long.reply, 20_000, 'reply of the interrupted cell');
    expect(reply.content.ename).toBe('Interrupted');
    expect((await run('"alive after"')).reply.content.status).toBe('ok');
  });

  it('shutdown_request on control: replies, goes idle and the process exits with code 0', async () => {
    const { reply } = await client.request('control', 'shutdown_request', { restart: false });
    expect(reply.content).toMatchObject({ status: 'ok', restart: false });
    expect(await withTimeout(client.exitCode, 15_000, 'kernel exit')).toBe(0);
  });
});
