// The advisor: a pure, deterministic module (no database, React or Next). See docs/advisor.md.
export { rankCams, predictCurve, PREDICTION_NOTICE } from './rank';
export {
  valveEvents,
  eventsFromDurations,
  seatIntakeClosingDeg,
  seatOverlapDeg,
  overlap050Deg,
  SEAT_TIMING_ALLOWANCE_DEG,
} from './valve-events';
export type { ValveEvents, ValveEventSet } from './valve-events';
export { dynamicCompression, dynamicCompressionRatio, clearanceVolumeCi } from './compression';
export {
  displacementCi,
  cylinderVolumeCi,
  litresFromCubicInches,
  meanPistonSpeedFtMin,
  pistonTravelFromTdcIn,
  crankToPinDistanceIn,
} from './geometry';
export { cruiseRpm, buildCruiseRpm, pullAwayRpm } from './drivetrain';
export { horsepower, HP_TORQUE_CONSTANT } from './horsepower';
export { idleVacuumInHg } from './idle';
export { crossoverRpm, leadStretch } from './crossover';
export { engineContext, camModel, torqueCurve } from './prediction';
export { modelDetail } from './model-detail';
export type { ModelDetail, SimulatedPoint } from './model-detail';
export { revLimitRpm, rpmGrid, VALVETRAIN_LIMIT_RPM } from './rpm-grid';
export { BAND, bandHalfWidthPct } from './bands';
export { SCORING_WEIGHTS, SUBSCORE_NAMES } from './weights';
export { NEED_KIND_LIST, NEED_LIFT_THRESHOLDS, springsCoverLift } from './needs';
export type { SubscoreName } from './weights';
export type { CurvePoint, PredictedSummary } from './curve';
export type {
  BaselineResult,
  CamRanking,
  CamSpecs,
  Caution,
  CautionKind,
  EngineFacts,
  HistoryAdjustment,
  HistoryEntry,
  Need,
  NeedKind,
  RankingResult,
  RankOptions,
  Reason,
  Subscores,
} from './types';
