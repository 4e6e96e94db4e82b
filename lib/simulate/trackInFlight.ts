import type { Particle } from '../particles.js';

/** A place and a direction of flight: position [m], unit direction. */
export interface PositionAndDirection {
  readonly xM: number;
  readonly yM: number;
  readonly zM: number;
  readonly ux: number;
  readonly uy: number;
  readonly uz: number;
}

/** A particle of a species in flight: position [m], unit direction, momentum [GeV/c]. */
export interface ParticleInFlight extends PositionAndDirection {
  readonly species: Particle;
  readonly momentumGeV: number;
}

/** A particle entering transport. */
export interface TrackStart extends ParticleInFlight {
  /**
   * Proper decay length [m] this particle will live (drawn by the caller from an exponential of
   * mean cτ); the track ends with reason 'decayed' after that much proper path. Absent: stable.
   */
  readonly properDecayLengthM?: number;
}

/** Receives the true position of each hit and the momentum there. */
export type HitSink = (xM: number, yM: number, zM: number, momentumGeV: number) => void;
/** Receives a knock-on electron (position [m], unit direction, kinetic energy [MeV]). */
export type DeltaSink = (xM: number, yM: number, zM: number, ux: number, uy: number, uz: number, kineticMeV: number) => void;

export type EndReason = 'stopped' | 'exited' | 'max-path' | 'decayed';

/** How and where a track ended. */
export interface TrackEnd extends PositionAndDirection {
  readonly reason: EndReason;
  /** Momentum at the end [GeV/c]; 0 when stopped; at the decay point when decayed. */
  readonly momentumGeV: number;
  /** Path length travelled inside the chamber [m]. */
  readonly pathM: number;
  /** Hits handed to the sink. */
  readonly hits: number;
}
