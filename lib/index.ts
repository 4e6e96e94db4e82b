// The public API of Sagitta: named re-exports only (STYLE.md §16), grouped by room in data-flow
// order. Plumbing the kernel needs (catalogue factories, atomic writes, display sinks, scratch
// allocators) is not here: it is in lib/internal.ts. test/apiSurface.test.ts lists every name.

// ── Core: errors, warnings, constants, species, units, provenance, knobs, display channel
export { ATOMIC_MASS_UNIT_MEV, AVOGADRO_PER_MOL, BETHE_K_MEV_CM2_PER_MOL, CLASSICAL_ELECTRON_RADIUS_CM, ELECTRON_CHARGE_TO_MASS_C_KG, ELECTRON_MASS_KG, ELECTRON_MASS_MEV, ELEMENTARY_CHARGE_C, FINE_STRUCTURE, GEV_PER_TESLA_METRE, HBAR_C_MEV_FM, SPEED_OF_LIGHT_M_S, VACUUM_PERMEABILITY_N_A2 } from './constants.js';
export { asMime, ask, clearOutput, present, refresh, type MimeBundle, type Presentable } from './display.js';
export { SagittaError, type SagittaErrorCode, type SourceLocation } from './errors.js';
export { knob } from './knob.js';
export { ALPHA, ANTIPROTON, DEUTERON, ELECTRON, KAON_MINUS, KAON_PLUS, KAON_SHORT, LAMBDA, MUON_MINUS, MUON_PLUS, PARTICLES, PION_MINUS, PION_PLUS, POSITRON, PROTON, particle, type Particle } from './particles.js';
export { recordCaution, recordInput, recordSeed, type CautionKind, type InputRecord, type SeedRecord } from './provenance.js';
export { angleRad, arealDensityGcm2, energyMeV, fieldTesla, lengthMetres, momentumGeV, pointMetres, quantity, type Dimension, type QuantityOptions } from './units.js';
export { WARNING_CODES, consumeWarnings, formatWarning, type SagittaWarning, type SagittaWarningCode } from './warnings.js';

// ── table: result tables of our own look, with selection verbs
export { formatMeasured } from './table/formatCell.js';
export { TABLE_CAUTION, TableView, tableView, type TableRow, type TableViewOptions } from './table/tableView.js';
export { trackRows } from './table/trackRows.js';

// ── io: reading and writing hit and result tables
export { columnTableToDataFrame, formatCsv, rowObjects, type Column, type ColumnTable } from './io/columnTable.js';
export { HIT_COLUMNS, REQUIRED_HIT_COLUMNS } from './io/hitColumns.js';
export { type HitTable, type HitTableSource, type TrackIndex } from './io/hitTable.js';
export { type HitCoordinates } from './io/hitCoordinates.js';
export { hitsToDataFrame } from './io/hitsToDataFrame.js';
export { READ_HITS_DEFAULTS, type ReadHitsOptions } from './io/parseHitsCsv.js';
export { HIT_FILE_FORMATS, readHits } from './io/readHits.js';
export { readNumberColumns } from './io/readNumberColumns.js';

// ── find: track finding among unlabelled hits
export { FIND_TRACKS_DEFAULTS, findTracks, type FindHits, type FindTracksOptions, type FoundTracks, type HitErrorSource } from './find/findTracks.js';
export { labelHits } from './find/labelHits.js';
export { MATCH_DEFAULTS, matchFoundTracks, type MatchOptions, type TrackMatch } from './find/matchFoundTracks.js';
export { DIRECTION_RULES, type DirectionRule } from './find/travelDirection.js';

// ── fit: circle, helix and line fits; the fitter registry
export { FIT_STATUS, type CircleFit, type CircleFitColumns, type FitStatus } from './fit/circleFit.js';
export { defineFitMethod, type FitMethodSpec, type TrackFitResult, type TrackHits } from './fit/defineFitMethod.js';
export { CIRCLE_FIT_DEFAULTS, fitCircle, fitCircles, type CircleFitOptions } from './fit/fitCircles.js';
export { fitHelices, fitHelix, type HelixFit, type HelixFitColumns, type SpaceHits } from './fit/fitHelices.js';
export { fitLine, type LineFit } from './fit/fitLine.js';
export { type CircleFitMethod, type FitContext, type FitMethod, type HelixFitMethod } from './fit/fitMethod.js';
export { BUILT_IN_FIT_METHODS, fitMethod, fitMethods, registerFitMethod } from './fit/fitMethods.js';
export { MATTER_FIT_DEFAULTS, MATTER_FIT_MIN_HITS, MATTER_FIT_MIN_PROBABILITY, MATTER_FIT_STATUS, STOP_CONSTRAINT_SPACINGS, fitTrackInMatter, fitTracksInMatter, type MatterBatchFitOptions, type MatterFitColumns, type MatterFitOptions, type MatterFitState, type MatterFitStatus, type MatterTrackColumnsHits, type MatterTrackFit, type MatterTrackHits } from './fit/matter/index.js';
export { GEOMETRIC_FIT_DEFAULTS, GEOMETRIC_METHOD, type GeometricFitOptions } from './fit/geometricCircle.js';
export { KASA_METHOD } from './fit/kasaCircle.js';
export { type PlaneHits } from './fit/preparePlaneHits.js';
export { TAUBIN_METHOD } from './fit/taubinCircle.js';

// ── matter: materials, stopping power, range, straggling, multiple scattering
export { BETHE_MAX_BETA_GAMMA, BETHE_MIN_BETA_GAMMA, betheStoppingPower, maxEnergyTransferMeV } from './matter/bethe.js';
export { SHELL_MIN_BETA_GAMMA, blochCorrection, materialShellCorrection, shellCorrectionOverZ } from './matter/betheCorrections.js';
export { bohrVarianceMeV2 } from './matter/bohrStraggling.js';
export { rangeStragglingGcm2 } from './matter/rangeStraggling.js';
export { chamberMedium } from './matter/chamberMedium.js';
export { densityEffectDelta, type DensityEffect } from './matter/densityEffect.js';
export { ELECTRON_MAX_MEV, ELECTRON_MIN_MEV, electronCollisionStoppingPower, electronRadiativeStoppingPower } from './matter/electronLoss.js';
export { EXTRAPOLATION_BELOW_PROTON_MEV, heavyElectronicStopping, stoppingRegime, type StoppingRegime } from './matter/electronicStopping.js';
export { ELEMENTS, element, type Element } from './matter/elements.js';
export { heliumEffectiveChargeSquared } from './matter/heliumEffectiveCharge.js';
export { HIGHLAND_MAX_X_OVER_X0, HIGHLAND_MIN_X_OVER_X0, HIGHLAND_RELATIVE_ACCURACY, highlandTheta0, highlandTheta0InMaterial, radiationLengthM, type HighlandInput } from './matter/highland.js';
export { betaFromKinetic, betaFromMomentum, betaGamma, gammaFromKinetic, kinematicsFromKinetic, kineticFromBetaGamma, kineticFromMomentum, momentumFromKinetic, type Kinematics } from './matter/kinematics.js';
export { heliumFitStopping, protonFitStopping } from './matter/lowEnergyFits.js';
export { MATERIALS, compound, material, mixture, type Constituent, type Material, type MixtureOptions, type MixturePart } from './matter/materials.js';
export { VACUUM, type Medium, type SpeciesLoss } from './matter/medium.js';
export { LANDAU_MAX_KAPPA, LANDAU_MAX_LOSS_FRACTION, mostProbableEnergyLoss, type MostProbableLoss } from './matter/mostProbableLoss.js';
export { nuclearStoppingPower } from './matter/nuclearStopping.js';
export { radiationLengthTsai } from './matter/radiationLength.js';
export { csdaRange, csdaRangeFromMomentum, energyAfterPath, kineticEnergyFromRange, momentumFromRange, residualRange } from './matter/range.js';
export { rangeCutoffMeV, rangeMaxMeV } from './matter/rangeIntegral.js';
export { rangeLookup, type RangeLookup } from './matter/rangeLookup.js';
export { energyAtRange, rangeAt, rangeTable, type RangeTable, type RangeTableOptions } from './matter/rangeTable.js';
export { rangeTableFrame } from './matter/rangeTableFrame.js';
export { collisionStoppingPower, linearStoppingPower, massStoppingPower, radiativeStoppingPower } from './matter/stoppingPower.js';

// ── track: momentum, error budget, per-track access
export { BACKWARDS_SHARE, checkHitOrder } from './track/hitOrderCheck.js';
export { measureTracks, type MeasureTracksOptions, type TrackTable } from './track/measureTracks.js';
export { momenta, momentumAt, radiusOfCurvatureM, transverseMomentumGeV, type MomentumColumns, type MomentumOptions, type TrackMomentum } from './track/momentum.js';
export { MS_GLUCKSTERN_FACTOR, curvatureSigmaEquallySpaced, curvatureSigmaLeastSquares, glucksternCurvatureSigma, momentumResolution, multipleScatteringCurvatureSigma, type MomentumResolution, type MomentumResolutionInput } from './track/resolution.js';
export { resolutionBudget, resolutionBudgetColumns, type ResolutionBudgetColumns, type ResolutionBudgetOptions } from './track/resolutionBudget.js';
export { trackHits, type OneTrackHits } from './track/trackHits.js';
export { trackTableColumns } from './track/trackTableColumns.js';
// stopping tracks and identification by range
export { PID_SPECIES, chargedSpecies } from './track/chargedSpecies.js';
export { IDENTIFY_DEFAULTS, MIN_HITS, UNDECIDED, identifyTrack, type IdentifyTrackOptions, type TrackHypothesis, type TrackIdentity } from './track/identifyTrack.js';
export { identifyTracks, type IdentifiedTracks } from './track/identifyTracks.js';
export { type HypothesisFit } from './track/fitHypothesis.js';
export { initialMomentumFromRange } from './track/initialMomentumFromRange.js';
export { LINK_STOP_DECAYS_DEFAULTS, linkStopDecays, type LinkStopDecaysOptions, type StopDecayLinks } from './track/linkStopDecays.js';
export { meanHitSpacingM, pathLengthsM, residualRangesM } from './track/pathLength.js';
export { momentumAgainstResidualRange, predictedCurvature, type MomentumAgainstRange } from './track/profileAlongTrack.js';
export { SEGMENT_CURVATURE_DEFAULTS, segmentCurvatures, type SegmentCurvatureOptions, type SegmentCurvatures, type SegmentHits } from './track/segmentCurvatures.js';
export { ELECTRON_RANGE_SPREAD, RANGE_TABLE_ACCURACY, speciesRange, type SpeciesRange } from './track/speciesRange.js';
export { STOPS_INSIDE_DEFAULTS, curvatureSlopeSignificance, endsInside, stopsInside, type FiducialBox, type StopDecision, type StopsInsideOptions } from './track/stopsInside.js';

// ── analysis: histograms, fitting layer, statistics
export { addHistograms } from './analysis/addHistograms.js';
export { binCounts, type BinnedCounts } from './analysis/binCounts.js';
export { binErrors, type BinErrorOptions, type BinErrors } from './analysis/binErrors.js';
export { chi2Quantile } from './analysis/chi2Quantile.js';
export { michelEndpoint } from './analysis/michelEndpoint.js';
export { chi2Survival } from './analysis/chi2Survival.js';
export { erf, erfc } from './analysis/erf.js';
export { fitHistogram, type BinnedMethod, type FitHistogramOptions } from './analysis/fitHistogram.js';
export { fitLinear, type FitLinearOptions, type LinearFitData } from './analysis/fitLinear.js';
export { fitModel, type FitData, type FitModelOptions } from './analysis/fitModel.js';
export { type ParameterOptions, type ParameterStart } from './analysis/fitParameters.js';
export { type FitResult, type FittedParameter, type ModelFitMethod, type ModelFitStatus } from './analysis/fitResult.js';
export { fitStraightLine, type FitStraightLineOptions } from './analysis/fitStraightLine.js';
export { fitUnbinned, type FitUnbinnedOptions } from './analysis/fitUnbinned.js';
export { Histogram, type HistogramBinning } from './analysis/histogram.js';
export { Histogram2D, type Histogram2DBinning } from './analysis/histogram2d.js';
export { LEVENBERG_MARQUARDT_DEFAULTS, levenbergMarquardt, type LevenbergMarquardtResult, type LevenbergMarquardtSettings, type MinimiserStatus, type ResidualProblem } from './analysis/levenbergMarquardt.js';
export { lnGamma } from './analysis/lnGamma.js';
export { MINIMISE_ON_INTERVAL_DEFAULTS, minimiseOnInterval, type IntervalMinimum, type MinimiseOnIntervalOptions } from './analysis/minimiseOnInterval.js';
export { normalCdf } from './analysis/normalCdf.js';
export { normalQuantile } from './analysis/normalQuantile.js';
export { numericalHessian } from './analysis/numericalHessian.js';
export { numericalJacobian, type JacobianSettings } from './analysis/numericalJacobian.js';
export { ONE_SIGMA_CL, poissonInterval, poissonLimit, type PoissonInterval } from './analysis/poissonInterval.js';
export { propagateErrors, type PropagatedErrors } from './analysis/propagateErrors.js';
export { QUASI_NEWTON_DEFAULTS, minimizeQuasiNewton, type QuasiNewtonResult, type QuasiNewtonSettings, type ScalarProblem } from './analysis/quasiNewton.js';
export { regularizedGammaP, regularizedGammaQ } from './analysis/regularizedGamma.js';
export { normaliseHistogram, scaleHistogram, type Normalisation } from './analysis/scaleHistogram.js';
export { breitWigner } from './analysis/shapes/breitWigner.js';
export { exponential } from './analysis/shapes/exponential.js';
export { faddeeva } from './analysis/shapes/faddeeva.js';
export { gaussian } from './analysis/shapes/gaussian.js';
export { michelSpectrum } from './analysis/shapes/michelSpectrum.js';
export { polynomial } from './analysis/shapes/polynomial.js';
export { customShape, isShape, type Model, type ModelFunction, type Shape } from './analysis/shapes/shape.js';
export { sumShapes } from './analysis/shapes/sumShapes.js';
export { voigt } from './analysis/shapes/voigt.js';
export { weightedMean, type WeightedMean } from './analysis/weightedMean.js';

// ── vertex: four-vectors, vertices, V0 and kink finders, lifetimes
export { armenteros } from './vertex/armenteros.js';
export { CLOSEST_APPROACH_DEFAULTS, circleCrossings, closestApproach, type ClosestApproach } from './vertex/closestApproach.js';
export { KINK_FINDER_DEFAULTS, findKinks, type KinkCandidates, type KinkFinderOptions, type KinkFinderResult } from './vertex/findKinks.js';
export { V0_FINDER_DEFAULTS, findV0s, type V0FinderOptions, type V0FinderResult } from './vertex/findV0s.js';
export { decayWindowInBox, fitLifetime, type LifetimeFit } from './vertex/fitLifetime.js';
export { fitMassPeak, type MassPeakFit } from './vertex/fitMassPeak.js';
export { fourMomentum, invariantMassMeV, sumFourVectors, type FourVector } from './vertex/fourVector.js';
export { helixCentre, helixPoint, type HelixParameters } from './vertex/helixParameters.js';
export { invariantMassWithError, type MomentumWithCovariance } from './vertex/invariantMassError.js';
export { boostFourVector, toRestFrame } from './vertex/lorentzBoost.js';
export { energyLossFactor, trackStateAt, type TrackState, type TrackStateOptions } from './vertex/trackState.js';
export { twoBodyMomentumMeV } from './vertex/twoBodyMomentum.js';
export { fitTwoTrackVertex, type TwoTrackVertex } from './vertex/twoTrackVertex.js';
export { v0CandidateColumns } from './vertex/v0CandidateColumns.js';
export { type V0Candidates } from './vertex/v0Candidates.js';
export { v0Masses, type DaughterHypotheses, type V0MassContext } from './vertex/v0Masses.js';
export { transverseMomentumMeV, vertexTracks, type VertexTracks, type VertexTracksOptions } from './vertex/vertexTracks.js';

// ── beam: e/m, m/q, fields, rigidity, spectrometers
export { chargeToMassFromOrbit, type ChargeToMassResult, type OrbitMeasurement } from './beam/chargeToMass.js';
export { cyclotronFrequencyHz } from './beam/cyclotronFrequency.js';
export { completeEllipticE, completeEllipticIntegrals, completeEllipticK } from './beam/ellipticIntegrals.js';
export { fitChargeToMass, type ChargeToMassFit, type ChargeToMassFitOptions, type ChargeToMassPoint } from './beam/fitChargeToMass.js';
export { helmholtzCentreFieldT, helmholtzField, orbitFieldUniformity, type CoilPair, type OrbitFieldUniformity } from './beam/helmholtzField.js';
export { ELECTRON_MASS_U, ISOTOPES, identifyIsotope, isotope, type Isotope, type IsotopeMatch } from './beam/isotopes.js';
export { ATOMIC_MASS_CONSTANT_KG, massToChargeFromSector, massToChargeInU, sectorRadiusM } from './beam/magneticSector.js';
export { plateDeflection, type PlateDeflection } from './beam/plateDeflection.js';
export { magneticRigidityTm, rigidityFromKineticTm } from './beam/rigidity.js';
export { selectedSpeedMPerS } from './beam/velocitySelector.js';

// ── plot: figure specs and event displays
export { curvatureAlongTrackFigure } from './plot/curvatureAlongTrackFigure.js';
export { EventDisplay, eventDisplay, type DisplayHits, type DisplayTrack, type EventDisplayOptions } from './plot/eventDisplay.js';
export { Figure, type PlotSpec, type PlotTrace } from './plot/figure.js';
export { histogramFigure, type HistogramOptions } from './plot/histogram.js';
export { histogram2dFigure, type Histogram2DFigureOptions } from './plot/histogram2dFigure.js';
export { momentumRangeFigure, type MomentumRangePoints } from './plot/momentumRangeFigure.js';
export { DENSITY_SCALE, PALETTE, SERIES_COLOURS, SERIES_DASHES, SERIES_MARKERS, chargeColour, seriesStyle, type SeriesStyle } from './plot/palette.js';
export { spectrumFigure, type SpectrumFigureOptions } from './plot/spectrumFigure.js';
export { figureSvg, type FigureSvgOptions } from './plot/static/figureSvg.js';
export { svgToPng } from './plot/static/svgToPng.js';
export { eventArcs, trackEventDisplay, type EventArcs } from './plot/trackEventDisplay.js';
export { xyFigure, type XYOptions, type XYSeries } from './plot/xyFigure.js';

// ── simulate: the seeded chamber simulator
export { chamber, insideChamber, type Chamber, type ChamberField, type ChamberOptions } from './simulate/chamber.js';
export { DECAY_AT_REST, DECAY_IN_FLIGHT, NEUTRAL_DECAYS } from './simulate/decays.js';
export { michelMaxEnergyMeV } from './simulate/michel.js';
export { readTruth } from './simulate/readTruth.js';
export { seededRandom, type SeededRandom } from './simulate/rng.js';
export { SCENARIO_DEFAULTS, parseScenario, readScenario, resolveScenario } from './simulate/scenario.js';
export { SCENARIO_SCHEMA } from './simulate/scenarioSchema.js';
export { simulateChamber, simulateChamberInParts, type SimulationTotals, type HitTruth, type MeasurementModel, type SimulationConfig, type SimulationResult, type Source, type TransportSettings, type TruthTable } from './simulate/simulate.js';
export { TRUTH_CSV_COLUMNS, formatHitsCsv, formatRunRecord, formatRunRecordTotals, formatTruthCsv, type CsvPartOptions } from './simulate/simulationCsv.js';
export { type BeamSource } from './simulate/sources/beam.js';
export { type BurstSource } from './simulate/sources/burst.js';
export { type CosmicSource } from './simulate/sources/cosmic.js';
export { type StoppingSource } from './simulate/sources/stopping.js';
export { TRANSPORT_DEFAULTS, type EnergyLossMode, type Sampling, type TransportOptions } from './simulate/transportOptions.js';
export { truthToDataFrame } from './simulate/truthFrame.js';
export { twoBodyDecay, type TwoBodyProducts } from './simulate/twoBodyDecay.js';

// ── fitlab: comparing fitters and finders on simulated truth
export { compareFitters, type BinnedMerit, type CompareOptions, type FitLabReport, type FitMerit, type FitterTrackColumns } from './fitlab/compare.js';
export { meritFigure, pValueFigure, pullFigure } from './fitlab/figures.js';
export { findingFigure } from './fitlab/findingFigure.js';
export { findingLab, type FindingBin, type FindingLabOptions, type FindingLabReport, type FindingSummary } from './fitlab/findingLab.js';
export { fitLabSample, type FitLabSample, type FitLabSampleOptions } from './fitlab/sample.js';
export { matterSample, type MatterSample, type MatterSampleOptions } from './fitlab/matterSample.js';
export { matterFitLab, type MatterFitLabBin, type MatterFitLabOptions, type MatterFitLabReport, type MatterFitMerit } from './fitlab/matterFitLab.js';
export { fitLabSampleFromRun, type SampleFromRunOptions } from './fitlab/sampleFromRun.js';
export { fitLabTables } from './fitlab/tables.js';
export { withNoiseHits } from './fitlab/withNoiseHits.js';
