/**
 * Hit rows as they are simulated: measured and true positions, true momentum. A dedicated class
 * with one typed array per field (rather than a generic column buffer) so that the per-hit write
 * compiles to plain stores.
 */
export class HitRecorder {
  private cap: number;
  n = 0;
  event: Float64Array; track: Float64Array; x: Float64Array; y: Float64Array; z: Float64Array;
  tx: Float64Array; ty: Float64Array; tz: Float64Array; tp: Float64Array;

  constructor(capacity: number) {
    this.cap = capacity;
    this.event = new Float64Array(capacity); this.track = new Float64Array(capacity);
    this.x = new Float64Array(capacity); this.y = new Float64Array(capacity); this.z = new Float64Array(capacity);
    this.tx = new Float64Array(capacity); this.ty = new Float64Array(capacity); this.tz = new Float64Array(capacity);
    this.tp = new Float64Array(capacity);
  }

  add(event: number, track: number, x: number, y: number, z: number, tx: number, ty: number, tz: number, tp: number): void {
    if (this.n === this.cap) this.grow();
    const i = this.n++;
    this.event[i] = event; this.track[i] = track;
    this.x[i] = x; this.y[i] = y; this.z[i] = z;
    this.tx[i] = tx; this.ty[i] = ty; this.tz[i] = tz; this.tp[i] = tp;
  }

  private grow(): void {
    this.cap *= 2;
    const g = (a: Float64Array) => {
      const b = new Float64Array(this.cap);
      b.set(a);
      return b;
    };
    this.event = g(this.event); this.track = g(this.track);
    this.x = g(this.x); this.y = g(this.y); this.z = g(this.z);
    this.tx = g(this.tx); this.ty = g(this.ty); this.tz = g(this.tz); this.tp = g(this.tp);
  }

  /** Exact-length columns (views when at least half the buffer is used). */
  column(name: 'event' | 'track' | 'x' | 'y' | 'z' | 'tx' | 'ty' | 'tz' | 'tp'): Float64Array {
    const a = this[name];
    return 2 * this.n >= this.cap ? a.subarray(0, this.n) : a.slice(0, this.n);
  }
}
