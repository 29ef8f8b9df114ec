// A factory-baseline cam as the interview form and the questionnaire offer it ("the cam in the engine now").

export type BaselineCardOption = {
  id: number;
  sku: string;
  name: string;
  baselineForLiters: number | null;
  intakeDuration050: number;
  exhaustDuration050: number;
  intakeAdvertised: number | null;
  exhaustAdvertised: number | null;
  intakeLiftIn: number;
  exhaustLiftIn: number;
  lsa: number;
  intakeCenterline: number;
  rockerRatio: number;
  springMaxLiftIn: number | null;
};
