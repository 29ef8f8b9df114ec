// A large catalogue is ranked without running the cycle model for cams that cannot reach the top ten.
// Most of a cam's score needs no torque curve (idle, compression, fit, emissions and, nearly, cost); only
// the powerband and converter sub-scores do. Giving a cam full marks on those two and the cheapest job
// its fit allows bounds its total from above. Cams are then modelled best bound first, and once the next
// bound is below the tenth best modelled score, no cam left can enter the top ten: the top ten is exactly
// the full model's, whatever the catalogue (tests/unit/advisor/screening.test.ts checks it against the
// full model). Tried and dropped: a coarse run of the cycle model (4° steps) and a quadratic response
// surface fitted to a sample; both missed top-ten cams on generated catalogues.

export const SCREENING = {
  /** Catalogues up to this size are ranked with the full model only (the demo has 14 cams). */
  fullModelUpToCams: 40,
  /** The places the bound protects. */
  protectedTop: 10,
  /** Scores are shown to 0.1: a bound must clear the tenth score by more than half of that. */
  roundingPoints: 0.05,
} as const;

export type RuledOut = { camId: string | number; camName: string; maxScore: number };
