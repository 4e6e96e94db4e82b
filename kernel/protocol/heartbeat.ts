import type * as zmq from 'zeromq';

/**
 * The heartbeat (messaging spec, "Heartbeat for kernels"): every frame received is echoed at once.
 * Served from the control thread, so it keeps answering while a cell blocks the main thread.
 */
export async function serveHeartbeat(hb: zmq.Reply, stopping: () => boolean, log: (line: string) => void): Promise<void> {
  try {
    for await (const frames of hb) await hb.send(frames);
  } catch (err) {
    if (!stopping()) log(`heartbeat stopped: ${String(err)}`);
  }
}
