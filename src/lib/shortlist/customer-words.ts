import type { CautionKind } from '@/lib/advisor';
import { idleCharacter } from '@/lib/advisor/idle';
import { LOW_END_TOP_RPM } from '@/lib/advisor/curve';
import { grindNameOf } from '@/lib/catalogue/cam-card-of';
import { formatNumber } from '@/lib/format';
import { PLAIN_CAUTION, plainNeed } from '@/lib/leads/shortlist';
import { jobPriceText, type ComparedCam } from './comparison';

// One chosen cam told to the customer across the counter: what it does, what the job includes, what to know,
// and the whole-job price. Only what a customer may see is copied out of the ranking (no scores, stock,
// part numbers or labour codes), so nothing else can reach the screen the customer is looking at.

export type CustomerCam = {
  camId: ComparedCam['camId'];
  name: string;
  jobPrice: string;
  does: string[];
  includes: string[];
  /** This cam's own cautions; the ones every cam swap carries are listed once for the whole view. */
  knowFirst: string[];
};

const IDLE_SENTENCE = {
  smooth: 'It should idle smoothly, close to how it does now.',
  noticeable: 'It should idle with a light lope you can hear.',
  aggressive: 'It should idle with a big, choppy lope.',
} as const;

// The valvetrain and tune cautions come with every cam, and the view lists them once for all.
const PER_CAM_CAUTIONS: readonly CautionKind[] = ['emissions', 'brakes', 'converter'];

/** A catalogue cam by its grind name (the card name starts with the shop's SKU); a card given whole keeps its name. */
export const customerCamName = (cam: Pick<ComparedCam, 'camId' | 'camName'>) =>
  typeof cam.camId === 'number' ? grindNameOf(cam.camName) : cam.camName;

const aboutRpm = (rpm: number) => formatNumber(Math.round(rpm / 100) * 100, 0, 'rpm');

export function customerCam(cam: ComparedCam): CustomerCam {
  const gain = cam.predicted.gainPctPeakHp;
  const loss = cam.predicted.lowEndLossPct;
  return {
    camId: cam.camId,
    name: customerCamName(cam),
    jobPrice: jobPriceText(cam.jobPriceCents),
    does: [
      gain >= 0.5
        ? `About ${formatNumber(gain, 0, '%')} more peak power than the cam in your engine now.`
        : 'About the same peak power as the cam in your engine now.',
      cam.crossoverRpm === null
        ? 'It does not pull harder than your current cam anywhere in the rev range.'
        : `It starts pulling harder than your current cam from about ${aboutRpm(cam.crossoverRpm)}.`,
      loss >= 1
        ? `Below ${aboutRpm(LOW_END_TOP_RPM)} it gives up to about ${formatNumber(loss, 0, '%')} of the pulling power you have now.`
        : `Below ${aboutRpm(LOW_END_TOP_RPM)} it keeps the pulling power you have now.`,
      IDLE_SENTENCE[idleCharacter(cam.idleVacuumInHg)],
    ],
    includes: cam.needs.map((n) => plainNeed(n.kind, n.suggestedStallRpm)),
    knowFirst: [
      ...new Set(cam.cautions.filter((c) => PER_CAM_CAUTIONS.includes(c.kind)).map((c) => PLAIN_CAUTION[c.kind])),
    ],
  };
}
