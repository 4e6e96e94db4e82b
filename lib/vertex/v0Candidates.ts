/**
 * V⁰ candidates, struct-of-arrays: one row per opposite-charge pair that passed the cuts of
 * `findV0s`. Lengths [m], masses and momenta [MeV, MeV/c], proper times [ps].
 * Mass hypotheses: `pipi` π⁺π⁻ (K⁰_S), `ppi` positive as proton and negative as π⁻ (Λ),
 * `pip` positive as π⁺ and negative as antiproton (Λ̄), `ee` e⁺e⁻ (photon conversion).
 */
export interface V0Candidates {
  readonly count: number;
  readonly event: Float64Array;
  /** Track ids (as in the hit file) of the positive and negative daughter. */
  readonly trackPos: Float64Array;
  readonly trackNeg: Float64Array;
  /** Rows of the daughters in the `VertexTracks` the finder read. */
  readonly rowPos: Int32Array;
  readonly rowNeg: Int32Array;
  readonly xM: Float64Array;
  readonly yM: Float64Array;
  readonly zM: Float64Array;
  /** 6 per candidate: xx, xy, xz, yy, yz, zz [m²]. */
  readonly cov: Float64Array;
  readonly dcaM: Float64Array;
  readonly chi2: Float64Array;
  /** Distance from the primary point to the vertex [m] and its error. */
  readonly flightM: Float64Array;
  readonly sigmaFlightM: Float64Array;
  /** Angle between the flight direction and the V⁰ momentum [rad]. */
  readonly pointingRad: Float64Array;
  /** |p| of the V⁰ (ππ hypothesis) [MeV/c]. */
  readonly pMeV: Float64Array;
  readonly massPiPiMeV: Float64Array;
  readonly sigmaMassPiPiMeV: Float64Array;
  readonly massPPiMeV: Float64Array;
  readonly sigmaMassPPiMeV: Float64Array;
  readonly massPiPMeV: Float64Array;
  readonly sigmaMassPiPMeV: Float64Array;
  readonly massEEMeV: Float64Array;
  readonly sigmaMassEEMeV: Float64Array;
  readonly armenterosAlpha: Float64Array;
  readonly armenterosQtMeV: Float64Array;
  /** Proper time t = L·m/(p c) under the K⁰_S and the Λ (= Λ̄) mass [ps]. */
  readonly properTimeK0sPs: Float64Array;
  readonly properTimeLambdaPs: Float64Array;
  /** 'ok', or why a number is missing ('vertex-singular', 'ranged-out'). */
  readonly status: readonly string[];
}

export const V0_COLUMN_KEYS = [
  'event', 'trackPos', 'trackNeg', 'xM', 'yM', 'zM', 'dcaM', 'chi2', 'flightM', 'sigmaFlightM', 'pointingRad', 'pMeV',
  'massPiPiMeV', 'sigmaMassPiPiMeV', 'massPPiMeV', 'sigmaMassPPiMeV', 'massPiPMeV', 'sigmaMassPiPMeV', 'massEEMeV', 'sigmaMassEEMeV',
  'armenterosAlpha', 'armenterosQtMeV', 'properTimeK0sPs', 'properTimeLambdaPs',
] as const;

type NumericKey = (typeof V0_COLUMN_KEYS)[number];

/** Growable builder of `V0Candidates` (the finder does not know the count in advance). */
export class V0CandidateBuilder {
  private cap = 64;
  n = 0;
  cols: Record<NumericKey, Float64Array> = Object.fromEntries(V0_COLUMN_KEYS.map((k) => [k, new Float64Array(64)])) as Record<NumericKey, Float64Array>;
  rowPos = new Int32Array(64);
  rowNeg = new Int32Array(64);
  cov = new Float64Array(6 * 64);
  status: string[] = [];

  /** Opens a new row and returns its index; fill the columns through `cols[key][i]`. */
  add(rowPos: number, rowNeg: number, status: string): number {
    if (this.n === this.cap) this.grow();
    const i = this.n++;
    this.rowPos[i] = rowPos;
    this.rowNeg[i] = rowNeg;
    this.status.push(status);
    return i;
  }

  private grow(): void {
    this.cap *= 2;
    const g = <T extends Float64Array | Int32Array>(a: T, k = 1): T => {
      const b = new (a.constructor as { new (n: number): T })(this.cap * k);
      b.set(a);
      return b;
    };
    for (const k of V0_COLUMN_KEYS) this.cols[k] = g(this.cols[k]);
    this.rowPos = g(this.rowPos);
    this.rowNeg = g(this.rowNeg);
    this.cov = g(this.cov, 6);
  }

  finish(): V0Candidates {
    const n = this.n;
    const c = Object.fromEntries(V0_COLUMN_KEYS.map((k) => [k, this.cols[k].slice(0, n)])) as Record<NumericKey, Float64Array>;
    return { count: n, ...c, rowPos: this.rowPos.slice(0, n), rowNeg: this.rowNeg.slice(0, n), cov: this.cov.slice(0, 6 * n), status: this.status.slice() };
  }
}
