/**
 * The wire format of the notebook messaging protocol (version 5.x, "The Wire Protocol"):
 *
 *   [routing ids…, "<IDS|MSG>", signature, header, parent_header, metadata, content, buffers…]
 *
 * The signature is the hex HMAC-SHA256, keyed with the connection file's key, of the four JSON
 * frames header, parent_header, metadata and content in that order. An empty key means no
 * signing: the signature frame is empty and is not checked.
 */
import { createHmac, randomUUID, timingSafeEqual } from 'node:crypto';

export const DELIMITER = '<IDS|MSG>';
export const PROTOCOL_VERSION = '5.3';

export interface Header {
  msg_id: string;
  session: string;
  username: string;
  date: string;
  msg_type: string;
  version: string;
  [extra: string]: unknown;
}

export interface Message {
  identities: Buffer[];
  header: Header;
  parent_header: Partial<Header>;
  metadata: Record<string, unknown>;
  content: Record<string, unknown>;
  buffers: Buffer[];
}

export function sign(key: string, frames: readonly (Buffer | string)[]): string {
  if (key === '') return '';
  const hmac = createHmac('sha256', key);
  for (const f of frames) hmac.update(f);
  return hmac.digest('hex');
}

/** Why a received message was not accepted. */
export type DecodeFailure = 'no-delimiter' | 'too-few-frames' | 'bad-signature' | 'replayed' | 'bad-json';

/** Remembers recent signatures so that a captured message cannot be replayed (bounded memory). */
export class SignatureHistory {
  private readonly seen = new Set<string>();
  constructor(private readonly limit = 4096) {}
  /** False when `signature` was already seen. */
  add(signature: string): boolean {
    if (this.seen.has(signature)) return false;
    this.seen.add(signature);
    if (this.seen.size > this.limit) this.seen.delete(this.seen.values().next().value as string);
    return true;
  }
}

export function decode(frames: readonly Buffer[], key: string, history?: SignatureHistory): Message | DecodeFailure {
  const at = frames.findIndex((f) => f.length === DELIMITER.length && f.toString('latin1') === DELIMITER);
  if (at < 0) return 'no-delimiter';
  if (frames.length < at + 6) return 'too-few-frames';
  const [signature, header, parent, metadata, content] = frames.slice(at + 1, at + 6);
  if (key !== '') {
    const expected = Buffer.from(sign(key, [header, parent, metadata, content]), 'latin1');
    if (signature.length !== expected.length || !timingSafeEqual(signature, expected)) return 'bad-signature';
    if (history && !history.add(signature.toString('latin1'))) return 'replayed';
  }
  try {
    return {
      identities: frames.slice(0, at),
      header: JSON.parse(header.toString('utf8')) as Header,
      parent_header: JSON.parse(parent.toString('utf8')) as Partial<Header>,
      metadata: JSON.parse(metadata.toString('utf8')) as Record<string, unknown>,
      content: JSON.parse(content.toString('utf8')) as Record<string, unknown>,
      buffers: frames.slice(at + 6),
    };
  } catch {
    return 'bad-json';
  }
}

export function encode(
  key: string,
  identities: readonly (Buffer | string)[],
  header: Header,
  parent: Partial<Header>,
  metadata: Record<string, unknown>,
  content: Record<string, unknown>,
): Array<Buffer | string> {
  const json = [header, parent, metadata, content].map((x) => JSON.stringify(x));
  return [...identities, DELIMITER, sign(key, json), ...json];
}

export function makeHeader(msgType: string, session: string, username = 'kernel'): Header {
  return { msg_id: randomUUID(), session, username, date: new Date().toISOString(), msg_type: msgType, version: PROTOCOL_VERSION };
}
