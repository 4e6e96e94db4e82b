import type * as zmq from 'zeromq';

export type Sendable = Array<Buffer | string>;

/** Where frames for one channel go: a socket in this thread, or the control thread. */
export interface FrameSender {
  send(frames: Sendable): Promise<void>;
  drain(): Promise<void>;
}

/** zeromq allows one send at a time per socket; this keeps them in order. */
export class SendQueue implements FrameSender {
  private tail: Promise<void> = Promise.resolve();
  constructor(private readonly socket: zmq.Writable, private readonly onError: (err: unknown) => void) {}
  send(frames: Sendable): Promise<void> {
    this.tail = this.tail.then(() => this.socket.send(frames)).catch(this.onError);
    return this.tail;
  }
  drain(): Promise<void> {
    return this.tail;
  }
}
