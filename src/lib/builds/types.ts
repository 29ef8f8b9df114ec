import type { CamRecord } from '@/lib/catalogue/types';

// A factory-baseline cam as the interview form and the questionnaire offer it ("the cam in the engine now"):
// the catalogue's own record, cut down to the card's figures.
export type BaselineCardOption = Pick<
  CamRecord,
  | 'id'
  | 'sku'
  | 'name'
  | 'intakeDuration050'
  | 'exhaustDuration050'
  | 'intakeAdvertised'
  | 'exhaustAdvertised'
  | 'intakeLiftIn'
  | 'exhaustLiftIn'
  | 'lsa'
  | 'intakeCenterline'
  | 'rockerRatio'
  | 'springMaxLiftIn'
  | 'baselineForLiters'
>;
