/**
 * The kernel's wire format (kernel/protocol/wire.ts) against the messaging specification's
 * definition (Jupyter messaging protocol 5.3, "The Wire Protocol"): the signature is the hex
 * HMAC-SHA256 of header, parent_header, metadata and content; an empty key disables signing.
 */
import { createHmac } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { decode, DELIMITER, encode, makeHeader, SignatureHistory } from '../../kernel/protocol/wire.js';

const KEY = 'a0436f6c-1916-498b-8eb9-e81ab9368e84';

function framesOf(parts: Array<Buffer | string>): Buffer[] {
  return parts.map((p) => (typeof p === 'string' ? Buffer.from(p) : p));
}

describe('wire format', () => {
  it('encode signs the four JSON frames with HMAC-SHA256 (hex) after the routing ids and delimiter', () => {
    const header = makeHeader('kernel_info_reply', 'session-1');
    const frames = encode(KEY, [Buffer.from('client-7')], header, {}, {}, { status: 'ok' });
    expect(frames[1]).toBe(DELIMITER);
    const json = frames.slice(3) as string[];
    expect(frames[2]).toBe(createHmac('sha256', KEY).update(json.join('')).digest('hex'));
    expect(JSON.parse(json[0]).version).toBe('5.3');
  });

  it('decode accepts a correctly signed message and returns ids, header and content', () => {
    const frames = framesOf(encode(KEY, ['id-1'], makeHeader('execute_request', 's'), {}, {}, { code: '1 + 1' }));
    const msg = decode(frames, KEY);
    expect(typeof msg).toBe('object');
    if (typeof msg === 'string') return;
    expect(msg.identities.map(String)).toEqual(['id-1']);
    expect(msg.header.msg_type).toBe('execute_request');
    expect(msg.content).toEqual({ code: '1 + 1' });
  });

  it('decode rejects a tampered signature, a tampered body, and a replayed message', () => {
    const frames = framesOf(encode(KEY, ['id-1'], makeHeader('execute_request', 's'), {}, {}, { code: 'x' }));
    const badSig = frames.slice();
    badSig[2] = Buffer.from('0'.repeat(64));
    expect(decode(badSig, KEY)).toBe('bad-signature');
    const badBody = frames.slice();
    badBody[6] = Buffer.from(JSON.stringify({ code: 'rm()' }));
    expect(decode(badBody, KEY)).toBe('bad-signature');
    const history = new SignatureHistory();
    expect(typeof decode(frames, KEY, history)).toBe('object');
    expect(decode(frames, KEY, history)).toBe('replayed');
  });

  it('with an empty key, messages carry an empty signature and are not checked', () => {
    const frames = framesOf(encode('', [], makeHeader('status', 's'), {}, {}, { execution_state: 'idle' }));
    expect(frames[1].toString()).toBe('');
    expect(typeof decode(frames, '')).toBe('object');
  });

  it('decode reports a missing delimiter and too few frames', () => {
    expect(decode(framesOf(['a', 'b']), KEY)).toBe('no-delimiter');
    expect(decode(framesOf([DELIMITER, 'sig', '{}']), KEY)).toBe('too-few-frames');
  });
});
