import type { CautionKind, NeedKind } from '@/lib/advisor';
import { idleCharacter, type IdleCharacter } from '@/lib/advisor/idle';
import type { ShopRanking, ShopRankingEntry } from '@/lib/ranking/types';
import { formatMoney, formatNumber } from '@/lib/format';
import type { LeadAnswers } from '@/lib/schemas/lead';

// What the customer saw: the top three of the shop's ranking, retold in plain words for someone who
// is not in the trade (the advisor's own reasons are written for the counter and carry exact prices),
// frozen into the lead so the shop later sees exactly the shortlist the customer saw.
export const SHORTLIST_SIZE = 3;

export type ShortlistEntry = {
  rank: number;
  camId: string | number;
  camName: string;
  /** Predicted change in peak power against the cam in the engine now, % (indicative). */
  gainPctPeakHp: number;
  /**
   * The whole job before tax (cam, the parts and labour the shop's rules add, the tune), cents: the same
   * number the staff shortlist and a quote drafted from it show. Null when the cam has no price.
   */
  jobPriceCents?: number | null;
  /** Leads saved before the job price: the cam plus needed parts only, shown as "from $X". */
  fromPriceCents?: number;
  reasons: string[];
  alsoNeeds: string[];
  cautions: string[];
  emissionsCertified: boolean;
};
export type Shortlist = { entries: ShortlistEntry[]; notice: string; engineLiters: number };

const IDLE_WORDS: Record<IdleCharacter, string> = {
  smooth: 'idle smoothly',
  noticeable: 'idle with a little lope you can hear',
  aggressive: 'idle with a big, choppy lope',
};
const WISH_WORDS: Record<LeadAnswers['idle'], string> = {
  smooth: 'a smooth idle',
  noticeable: 'a little lope',
  aggressive: 'a big lope',
};
const USE_WORDS: Record<LeadAnswers['use'], string> = {
  daily: 'everyday driving',
  towing: 'towing',
  street: 'fun on the street',
  strip: 'the track',
};

const roundTo100 = (rpm: number) => formatNumber(Math.round(rpm / 100) * 100);
const wholePct = (n: number) => `${Math.round(Math.abs(n))} %`;

function plainReasons(
  r: ShopRankingEntry,
  answers: Pick<LeadAnswers, 'idle' | 'use'>,
  certified: boolean,
  emissionsRequired: boolean,
): string[] {
  const out: string[] = [];
  const gain = r.predicted.gainPctPeakHp;
  out.push(
    gain >= 0.5
      ? `About ${wholePct(gain)} more top-end power than the cam in your engine now (an estimate).`
      : 'About the same top-end power as the cam in your engine now (an estimate).',
  );
  out.push(
    r.predicted.lowEndLossPct >= 3
      ? `It gives up about ${wholePct(r.predicted.lowEndLossPct)} of pulling power low down (below 3,500 engine rpm), which matters for ${USE_WORDS[answers.use]}.`
      : 'It keeps the low-down pulling power you have now.',
  );
  if (r.crossoverRpm !== null)
    out.push(`It starts pulling harder than your current cam from about ${roundTo100(r.crossoverRpm)} engine rpm.`);
  const sound = idleCharacter(r.idleVacuumInHg);
  const matches = sound === answers.idle || (answers.idle === 'aggressive' && sound !== 'smooth');
  out.push(
    `It should ${IDLE_WORDS[sound]}${matches ? ', as you asked' : ` (you asked for ${WISH_WORDS[answers.idle]})`}.`,
  );
  out.push(
    certified
      ? 'It is certified for emissions-tested road use where its paperwork covers your vehicle.'
      : emissionsRequired
        ? 'It is not certified for emissions-tested road use, so it is only an option if your vehicle does not have to pass that test.'
        : 'It is not certified for emissions-tested road use; you told us the vehicle does not need to pass that test.',
  );
  return out;
}

export function plainNeed(kind: NeedKind, suggestedStallRpm?: number): string {
  switch (kind) {
    case 'install':
      return 'Fitting the cam: the front of the engine comes apart, so this is most of the work.';
    case 'pushrods':
      return 'Stronger pushrods, because this cam opens the valves further and the new springs push harder.';
    case 'lifters':
      return 'Lifters made for a cam that opens the valves this far.';
    case 'springs':
      return 'Stronger valve springs: this cam opens the valves further than the springs in there now are made for.';
    case 'deactivation-delete':
      return 'Switching off the cylinder-shutdown system (the fuel saver that runs the engine on four cylinders), with the parts that go with it.';
    case 'converter':
      return `A converter that lets the engine rev a little higher before the vehicle moves${suggestedStallRpm ? ` (about ${roundTo100(suggestedStallRpm)} rpm)` : ''}, so the cam works from the moment you pull away.`;
    case 'tune':
      return 'A re-tune of the engine computer for the new cam.';
  }
}

export const PLAIN_CAUTION: Record<CautionKind, string> = {
  emissions:
    'Not certified for emissions-tested road use: where your vehicle is tested, this cam may not be allowed. Your local rules decide.',
  brakes:
    'It lowers engine vacuum at idle, which power brakes rely on. A qualified technician checks brake assist; extra brake assist may be needed.',
  valvetrain:
    'Valve springs, piston-to-valve clearance and pushrod length must be checked on your engine by a qualified technician.',
  converter: 'A higher-stall converter changes how the vehicle creeps and pulls away from a stop.',
  tune: 'The engine must be re-tuned after the swap.',
};

/**
 * The top of the ranking the customer may choose from. A vehicle that must pass emissions (or "not sure",
 * treated as yes) never sees a cam that is not certified: the next certified cams move up instead, and
 * the choices are numbered 1, 2, 3 as shown. The advisor only scores such a cam down; this removes it.
 */
export function shortlistFrom(
  result: ShopRanking,
  answers: LeadAnswers,
  engineLiters: number,
  emissionsRequired: boolean,
  certified: (camId: string | number) => boolean,
): Shortlist {
  const allowed = result.rankings.filter((r) => !emissionsRequired || certified(r.camId));
  const entries = allowed.slice(0, SHORTLIST_SIZE).map((r, index) => {
    const isCertified = certified(r.camId);
    return {
      rank: index + 1,
      camId: r.camId,
      camName: r.camName,
      gainPctPeakHp: r.predicted.gainPctPeakHp,
      jobPriceCents: r.jobPriceCents,
      reasons: plainReasons(r, answers, isCertified, emissionsRequired),
      alsoNeeds: r.needs.map((n) => plainNeed(n.kind, n.suggestedStallRpm)),
      cautions: [...new Set(r.cautions.map((c) => PLAIN_CAUTION[c.kind]))],
      emissionsCertified: isCertified,
    };
  });
  return { entries, notice: result.notice, engineLiters };
}

/** The whole job's price as every screen shows it, to the cent: "$3,007.00". */
export function jobPrice(cents: number): string {
  return formatMoney(cents);
}

/** "from $1,250": rounded down to whole dollars, never a promise of an exact price. */
export function fromPrice(cents: number): string {
  return `from ${formatMoney(Math.floor(cents / 100) * 100, { whole: true })}`;
}

/**
 * A stored shortlist as the customer may see it now: leads saved before the emissions filter could hold a
 * non-certified cam for a vehicle that must pass; it is left out and the rest renumbered.
 */
export function shortlistForCustomer(
  shortlist: Shortlist,
  answers: Partial<Pick<LeadAnswers, 'emissions'>>,
): Shortlist {
  if (answers.emissions === 'no') return shortlist;
  const entries = shortlist.entries.filter((e) => e.emissionsCertified).map((e, index) => ({ ...e, rank: index + 1 }));
  return { ...shortlist, entries };
}
