import { readFileSync } from 'node:fs';
import { msg } from '../../lib/internal.js';

/** The connection file a front end writes before starting a kernel (messaging spec, "Connection files"). */
export interface ConnectionInfo {
  transport: 'tcp' | 'ipc';
  ip: string;
  shell_port: number;
  control_port: number;
  iopub_port: number;
  stdin_port: number;
  hb_port: number;
  /** HMAC key; empty means messages are neither signed nor checked. */
  key: string;
  signature_scheme: string;
  kernel_name?: string;
}

export type Channel = 'shell' | 'control' | 'iopub' | 'stdin' | 'hb';

/** Reads and checks a connection file; throws with the file name and the missing field. */
export function readConnectionFile(file: string): ConnectionInfo {
  const raw = JSON.parse(readFileSync(file, 'utf8')) as Partial<ConnectionInfo>;
  for (const field of ['ip', 'shell_port', 'control_port', 'iopub_port', 'stdin_port', 'hb_port'] as const) {
    if (raw[field] === undefined) throw msg.badConnectionFile(file, `it has no "${field}"`);
  }
  const scheme = raw.signature_scheme ?? 'hmac-sha256';
  if (scheme !== 'hmac-sha256') throw msg.badConnectionFile(file, `signature scheme "${scheme}" is not supported (only hmac-sha256)`);
  return { transport: raw.transport ?? 'tcp', key: raw.key ?? '', signature_scheme: scheme, ...raw } as ConnectionInfo;
}

/** The zeromq endpoint of one channel. */
export function endpoint(info: ConnectionInfo, channel: Channel): string {
  const port = info[`${channel === 'hb' ? 'hb' : channel}_port` as `${Channel}_port`];
  return info.transport === 'ipc' ? `ipc://${info.ip}-${port}` : `tcp://${info.ip}:${port}`;
}
