import type { CamCard } from '@/lib/schemas/cam-card';
import type { CurvePoint, PredictedSummary } from './curve';
import type { ValveEvents } from './valve-events';
import type { SubscoreName } from './weights';

/** What a cam swap can need; the manager's rules map each kind (and the vehicle class) to parts and labour. */
export type NeedKind = 'install' | 'springs' | 'pushrods' | 'lifters' | 'deactivation-delete' | 'converter' | 'tune';

/** Something the cam requires; the catalogue rules map these to parts and labour. */
export type Need = {
  kind: NeedKind;
  reason: string;
  /** springs: the kit must be good to at least this valve lift (in). */
  minLiftIn?: number;
  /** converter: suggested stall speed (rpm), rounded up to 100. */
  suggestedStallRpm?: number;
};

export type CautionKind = 'emissions' | 'brakes' | 'valvetrain' | 'tune' | 'converter';
export type Caution = { kind: CautionKind; text: string };

export type Reason = { subscore: SubscoreName; text: string };

export type Subscores = Record<SubscoreName, number>;

/** A measured result from a past job: used by options.history to nudge predicted gains. */
export type HistoryEntry = {
  camId: string | number;
  /** Measured peak-hp gain over the cam that came out, %, from before/after dyno pulls. */
  measuredGainPctPeakHp: number;
  /** The engine it was measured on, for similarity. */
  displacementCi: number;
  intakeFlowCfm?: number;
  headers?: 'manifold' | 'shorty' | 'long-tube';
  system?: 'full' | 'full-with-cats' | 'open-short';
  intakeManifold?: 'truck' | 'car' | 'single-plane';
  /** Trust in this record (e.g. number of pulls averaged); default 1. */
  weight?: number;
  /** The measured torque gain over the cam that came out, per rpm, where both pulls covered it (rising rpm). */
  measuredGainPctByRpm?: { rpm: number; gainPct: number }[];
};

export type HistoryAdjustment = {
  matches: number; // past jobs similar enough to count
  evidenceWeight: number; // their summed similarity · weight
  modelGainPctPeakHp: number;
  measuredGainPctPeakHp: number; // similarity-weighted mean of the measured gains
  adjustedGainPctPeakHp: number;
};

export type RankOptions = {
  history?: HistoryEntry[];
  /** Prices of what the needs map to (cents), so cost can compare the whole job with the budget. */
  needPriceCents?: Partial<Record<NeedKind, number>>;
  /**
   * The whole job before tax (cam, what its needs map to, labour, tune) in cents, from the shop's one
   * pricing function; when given, cost and its reason use this number (null: the cam has no price).
   */
  jobPriceCents?: (cam: CamCard, needs: readonly Need[]) => number | null;
  /** Leave the curves out of the output (the ranking itself is unchanged). Default true. */
  includeCurves?: boolean;
};

/** The cam card's own figures (never its price), so a side-by-side comparison reads them from the ranking. */
export type CamSpecs = Pick<
  CamCard,
  | 'intakeDuration050'
  | 'exhaustDuration050'
  | 'intakeLiftIn'
  | 'exhaustLiftIn'
  | 'lsa'
  | 'intakeCenterline'
  | 'rockerRatio'
> &
  Partial<Pick<CamCard, 'intakeAdvertised' | 'exhaustAdvertised'>>;

export type CamRanking = {
  camId: CamCard['id'];
  camName: string;
  specs: CamSpecs;
  rank: number;
  score: number;
  subscores: Subscores;
  crossoverRpm: number | null;
  /** The crossover moved by the model's calibration uncertainty on a cam's gain: [earliest, latest]. */
  crossoverRangeRpm: [number, number] | null;
  /** The longest stretch within the rev limit where it out-pulls the cam in the engine now. */
  leads: { fromRpm: number; toRpm: number } | null;
  /** The engine's real rev limit with this cam (valvetrain, upgraded when the cam comes with springs). */
  revLimitRpm: number;
  predicted: PredictedSummary;
  curve: CurvePoint[];
  valveEvents: ValveEvents;
  dynamicCompression: number;
  idleVacuumInHg: number;
  reasons: Reason[];
  cautions: Caution[];
  needs: Need[];
  history: HistoryAdjustment | null;
};

export type BaselineResult = {
  camId: CamCard['id'];
  camName: string;
  predicted: PredictedSummary;
  curve: CurvePoint[];
  valveEvents: ValveEvents;
  dynamicCompression: number;
  idleVacuumInHg: number;
};

export type EngineFacts = {
  displacementCi: number;
  displacementL: number;
  cylinderCi: number;
  cruiseRpm: number;
  pullAwayRpm: number;
  pullAwaySource: 'stall' | 'launch' | 'default-launch';
  rpmLimit: number; // top of the curves: 7,000 or the mean-piston-speed limit
  revLimitRpm: number; // the valvetrain's limit with the cam in the engine now
  meanPistonSpeedFtMinAtLimit: number;
  headFlowCeilingHp: number;
};

export type RankingResult = {
  rankings: CamRanking[];
  baseline: BaselineResult;
  engine: EngineFacts;
  notice: string;
  /** Cams of a large catalogue that could not reach the top ten, with the most they could score (screening.ts). */
  ruledOut: { camId: CamCard['id']; camName: string; maxScore: number }[];
};
