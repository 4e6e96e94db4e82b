import type { ModelFitStatus } from '../analysis/fitResult.js';
import { fitStraightLine } from '../analysis/fitStraightLine.js';
import { msg } from '../errors.js';

/** One point of an e/m series: accelerating voltage, field (or coil current) and orbit radius, with errors. */
export interface ChargeToMassPoint {
  readonly voltageV: number;
  readonly sigmaVoltageV: number;
  /** Field at the orbit [T]; or give `currentA` and the series' `teslaPerAmpere`. */
  readonly fieldT?: number;
  readonly sigmaFieldT?: number;
  readonly currentA?: number;
  readonly sigmaCurrentA?: number;
  readonly radiusM: number;
  readonly sigmaRadiusM: number;
}

export interface ChargeToMassFitOptions {
  /** Fit V = (q/m)·x through the origin (default) or V = V₀ + (q/m)·x with an offset V₀ (e.g. a contact potential). */
  readonly throughOrigin?: boolean;
  /** Field per coil current [T/A] when points give currents (e.g. `helmholtzCentreFieldT` at 1 A, or a measured calibration). */
  readonly teslaPerAmpere?: number;
  /** Relative systematic error of the field scale (coil geometry or probe calibration): q/m ∝ B⁻². */
  readonly fieldScaleRelative?: number;
  /** Relative systematic error of the radius scale (ruler or scale reading): q/m ∝ r⁻². */
  readonly radiusScaleRelative?: number;
}

export interface ChargeToMassFit {
  /** q/m [C/kg] and its statistical error (from the fit). */
  readonly valueCPerKg: number;
  readonly sigmaStatCPerKg: number;
  /** Systematic error from the field and radius scales: q/m·√((2δ_B)² + (2δ_r)²). */
  readonly sigmaSystCPerKg: number;
  /** Offset V₀ [V] and its error (0 through the origin). */
  readonly offsetV: number;
  readonly sigmaOffsetV: number;
  readonly chi2: number;
  readonly ndf: number;
  /** P(χ² ≥ observed) for ndf degrees of freedom: the fit-quality figure. */
  readonly pValue: number;
  /** 'ok', or how the straight-line fit failed (`FitResult.status`; values are then not to be trusted). */
  readonly status: ModelFitStatus;
  /** x = (Br)²/2 [T²m²] and its error per point, for plotting V against x. */
  readonly x: Float64Array;
  readonly sigmaX: Float64Array;
}

/**
 * q/m [C/kg] from a series of beam-tube points by regression: V = (q/m)·(Br)²/2 (from
 * q/m = 2V/(B²r²), common practice), a straight line in x = (Br)²/2 with errors on both axes —
 * σ_x from the field (or coil current) and radius errors, σ_V from the voltage — fitted through
 * the origin or with an offset (`fitStraightLine` of lib/analysis: the effective-variance χ²,
 * which for a straight line is the Gaussian likelihood with errors on both axes; errors from its
 * curvature). The field-scale and radius-scale uncertainties are common to every point, so they
 * do not enter the fit; they are given as the systematic error. Non-relativistic (as `chargeToMassFromOrbit`).
 * @example fitChargeToMass(points, { teslaPerAmpere: 7.79e-4, fieldScaleRelative: 0.005 }).valueCPerKg
 */
export function fitChargeToMass(points: readonly ChargeToMassPoint[], options: ChargeToMassFitOptions = {}): ChargeToMassFit {
  const origin = options.throughOrigin ?? true;
  if (points.length < (origin ? 2 : 3)) throw msg.badArgument('points.length', points.length, `at least ${origin ? 2 : 3} points`);
  const n = points.length;
  const x = new Float64Array(n), sx = new Float64Array(n), y = new Float64Array(n), sy = new Float64Array(n);
  points.forEach((p, i) => {
    let b: number, sb: number;
    if (p.fieldT !== undefined) { b = p.fieldT; sb = p.sigmaFieldT ?? 0; }
    else {
      const k = options.teslaPerAmpere;
      if (p.currentA === undefined || k === undefined) throw msg.badArgument(`points[${i}]`, p, 'a fieldT, or a currentA with options.teslaPerAmpere');
      b = k * p.currentA; sb = k * (p.sigmaCurrentA ?? 0);
    }
    if (!(p.voltageV > 0 && p.radiusM > 0 && Math.abs(b) > 0)) throw msg.badArgument(`points[${i}]`, p, 'positive voltage, radius and field');
    if (!(p.sigmaVoltageV > 0)) throw msg.badArgument(`points[${i}].sigmaVoltageV`, p.sigmaVoltageV, 'a positive voltage error');
    const br = b * p.radiusM;
    x[i] = 0.5 * br * br;
    sx[i] = x[i] * Math.hypot((2 * sb) / b, (2 * p.sigmaRadiusM) / p.radiusM);
    y[i] = p.voltageV;
    sy[i] = p.sigmaVoltageV;
  });
  const fit = fitStraightLine({ x, y, sigma: sy, xSigma: sx }, { throughOrigin: origin });
  const slope = fit.parameters.slope, offset = fit.parameters.intercept;
  const syst = Math.abs(slope.value) * Math.hypot(2 * (options.fieldScaleRelative ?? 0), 2 * (options.radiusScaleRelative ?? 0));
  return {
    valueCPerKg: slope.value, sigmaStatCPerKg: slope.error, sigmaSystCPerKg: syst,
    offsetV: offset?.value ?? 0, sigmaOffsetV: offset?.error ?? 0, chi2: fit.chi2, ndf: fit.ndf,
    pValue: fit.pValue, status: fit.status, x, sigmaX: sx,
  };
}
