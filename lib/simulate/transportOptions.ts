/** Where hits are taken: every `spacingM` of path length, or where the path crosses planes. */
export type Sampling =
  | { readonly kind: 'spacing'; readonly spacingM: number }
  /** Planes perpendicular to one axis (0 = x, 1 = y, 2 = z) at the given coordinates [m]. */
  | { readonly kind: 'planes'; readonly axis: 0 | 1 | 2; readonly positionsM: readonly number[] };

export type EnergyLossMode = 'mean' | 'straggling' | 'off';

export interface TransportOptions {
  /** Longest step [m]; hits and plane crossings are found exactly within a step. */
  readonly maxStepM: number;
  /** Largest fraction of the remaining range one step may use (keeps the spiral smooth). */
  readonly rangeFraction: number;
  /** 'mean' CSDA loss, 'straggling' adds Gaussian (Bohr) fluctuations, 'off' keeps |p| fixed. */
  readonly energyLoss: EnergyLossMode;
  /** Gaussian multiple scattering with the medium's θ₀ per step. */
  readonly scattering: boolean;
  /** A track is ended after this much path [m] (a looper in a field without loss never leaves). */
  readonly maxPathM: number;
  readonly sampling: Sampling;
  /** Emit knock-on electrons above this kinetic energy [MeV]; 0 or absent: none. */
  readonly deltaRayMinMeV?: number;
}

/** The one set of transport defaults (the scenario format takes its defaults from here). */
export const TRANSPORT_DEFAULTS: TransportOptions = Object.freeze({
  maxStepM: 0.01,
  rangeFraction: 0.2,
  energyLoss: 'mean',
  scattering: true,
  maxPathM: 50,
  sampling: Object.freeze({ kind: 'spacing', spacingM: 0.01 }) as Sampling,
});
