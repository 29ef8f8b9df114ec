import type { BuildProfile } from '@/lib/schemas/build-profile';
import { aboutRpm, dollars, dollarsAndCents, groupThousands, inches, oneDecimal, pct } from './format';
import { idleCharacter } from './idle';
import type {
  CompressionDetail,
  ConverterDetail,
  CostDetail,
  EmissionsDetail,
  FitDetail,
  IdleDetail,
  PowerbandDetail,
} from './scoring';
import type { Reason } from './types';

// One sentence per sub-score, in words a counter person can read aloud. Numbers are rounded the way
// people say them: rpm to the nearest 100, percentages to whole numbers, vacuum to whole inHg.

const USE_WORDS: Record<BuildProfile['use']['primary'], string> = {
  daily: 'a daily driver',
  towing: 'towing',
  street: 'street driving',
  strip: 'the strip',
};

export function powerbandReason(
  d: PowerbandDetail,
  build: BuildProfile,
  cruiseRpm: number,
  peakHp: number,
  gainPctPeakHp: number,
): Reason {
  const band = `${aboutRpm(d.bandFromRpm)}–${aboutRpm(d.bandToRpm)} rpm`;
  const cruise =
    build.use.primary === 'daily' || build.use.primary === 'towing'
      ? `, around your ${aboutRpm(cruiseRpm)} rpm cruise`
      : '';
  const change =
    Math.abs(d.avgGainPct) < 0.5
      ? 'about the same torque as your current cam'
      : `${pct(Math.abs(d.avgGainPct))} ${d.avgGainPct > 0 ? 'more' : 'less'} torque than your current cam`;
  const peak = `peak power about ${groupThousands(peakHp)} hp (${pct(gainPctPeakHp, true)})`;
  return {
    subscore: 'powerband',
    text: `Where ${USE_WORDS[build.use.primary]} lives (${band}${cruise}) it makes ${change} on average; ${peak}.`,
  };
}

export function converterReason(d: ConverterDetail): Reason {
  const what =
    d.transmission === 'automatic'
      ? `your ${groupThousands(d.pullAwayRpm)} converter`
      : `a ${aboutRpm(d.pullAwayRpm)} rpm launch`;
  let text: string;
  if (d.crossoverRpm === null) {
    if (d.lead && d.aheadAtPullAway)
      text = `Pulls harder than your current cam from ${what} up to about ${aboutRpm(d.lead.toRpm)} rpm, then falls a little behind near the limit.`;
    else if (d.lead)
      text = `Out-pulls your current cam from about ${aboutRpm(d.lead.fromRpm)} to ${aboutRpm(d.lead.toRpm)} rpm, then falls a little behind near the limit.`;
    else if (d.aheadAtPullAway)
      text = `Pulls harder than your current cam down low but never passes it up top; ${what} suits it.`;
    else
      text =
        "Never out-pulls your current cam anywhere up to the engine's rev limit, so it gives nothing back for the swap.";
  } else if (d.marginRpm !== null && d.marginRpm <= 0) {
    text = `Starts out-pulling your current cam at about ${aboutRpm(d.crossoverRpm)} rpm, already below ${what}, so it pulls from the moment the engine is loaded.`;
  } else if (d.score >= 95) {
    text = `Starts out-pulling your current cam at about ${aboutRpm(d.crossoverRpm)} rpm, close to ${what} — a good match.`;
  } else if (d.transmission === 'automatic') {
    const pair = d.suggestedStallRpm !== null ? ` — pair it with a ${groupThousands(d.suggestedStallRpm)} stall` : '';
    const range = d.crossoverRangeRpm
      ? ` (somewhere between ${aboutRpm(d.crossoverRangeRpm[0])} and ${aboutRpm(d.crossoverRangeRpm[1])})`
      : '';
    text =
      d.suggestedStallRpm !== null
        ? `Starts out-pulling your current cam at about ${aboutRpm(d.crossoverRpm)} rpm${range}; ${what} will feel soft off the line${pair}.`
        : `Starts out-pulling your current cam at about ${aboutRpm(d.crossoverRpm)} rpm${range}, a little above ${what}; it will feel much like now off the line.`;
  } else {
    text = `Starts out-pulling your current cam at about ${aboutRpm(d.crossoverRpm)} rpm, well above ${what}; expect to slip the clutch more or launch higher.`;
  }
  return { subscore: 'converter', text };
}

const WISH_WORDS: Record<BuildProfile['use']['idle'], string> = {
  smooth: 'a smooth idle',
  noticeable: 'a noticeable lope',
  aggressive: 'an aggressive lope',
};

export function idleReason(d: IdleDetail, build: BuildProfile): Reason {
  const character = idleCharacter(d.vacuumInHg);
  const sounds =
    character === 'smooth' ? 'a smooth idle' : character === 'noticeable' ? 'a noticeable lope' : 'an aggressive lope';
  // "Aggressive" means the customer wants to hear it: any lope is welcome, a smooth idle is not.
  const matches = character === d.wish || (d.wish === 'aggressive' && character !== 'smooth');
  let text = `Idles at about ${Math.round(d.vacuumInHg)} inHg of vacuum with ${sounds}${matches ? ', as you asked' : ` (you asked for ${WISH_WORDS[d.wish]})`}`;
  if (build.vehicle.powerBrakes === 'vacuum') {
    text +=
      d.brakesShortInHg > 0
        ? '; that is below the 15 inHg or so a vacuum brake booster wants.'
        : '; enough for the vacuum brake booster.';
  } else text += '.';
  return { subscore: 'idle', text };
}

export function compressionReason(d: CompressionDetail, build: BuildProfile): Reason {
  const heads = build.engine.headMaterial === 'iron' ? 'iron heads' : 'aluminium heads';
  const fuel = `${Math.round(build.use.fuelOctane)}-octane`;
  const range = `${oneDecimal(d.minDcr)}–${oneDecimal(d.maxDcr)}:1`;
  let text: string;
  if (d.dcr > d.maxDcr)
    text = `Dynamic compression about ${oneDecimal(d.dcr)}:1 — above the ${range} usually kept with ${fuel} fuel and ${heads}; knock risk, needs a careful tune or better fuel.`;
  else if (d.dcr < d.minDcr)
    text = `Dynamic compression about ${oneDecimal(d.dcr)}:1 — below the ${range} that suits ${fuel} fuel and ${heads}, so it will feel soft down low.`;
  else
    text = `Dynamic compression about ${oneDecimal(d.dcr)}:1 — inside the ${range} that ${fuel} fuel and ${heads} are usually kept to.`;
  return { subscore: 'compression', text };
}

export function fitReason(d: FitDetail): Reason {
  const parts: string[] = [];
  const limit = `${d.springLimitAssumed ? 'about ' : ''}${inches(d.springLimitIn)}`;
  parts.push(
    d.springsNeeded
      ? `Lift ${inches(d.maxLiftIn)} is past your installed springs' ${limit} limit — it needs springs`
      : `Lift ${inches(d.maxLiftIn)} is within your installed springs' ${limit} limit`,
  );
  parts.push(`piston-to-valve risk is ${d.ptvLevel}`);
  if (d.deactivation === 'active')
    parts.push(
      d.deleteNeeded
        ? 'not compatible with active cylinder deactivation, so it needs the delete'
        : 'compatible with your active cylinder deactivation',
    );
  return { subscore: 'fit', text: `${parts.join('; ')}.` };
}

export function emissionsReason(d: EmissionsDetail): Reason {
  let text: string;
  if (d.required)
    text = d.certified
      ? 'Certified for road use where its paperwork covers this vehicle.'
      : 'Not emissions-certified, and this vehicle must stay road-legal — do not sell it for this build.';
  else
    text = d.certified
      ? 'Emissions-certified, though you said road-legal emissions are not needed.'
      : 'Not emissions-certified; you said road-legal emissions are not needed for this vehicle.';
  return { subscore: 'emissions', text };
}

export function costReason(d: CostDetail): Reason {
  let text: string;
  if (d.priceCents === null || d.jobCents === null)
    text = 'No price on file for this cam; ask the manager before quoting.';
  else if (d.budgetCents <= 0) {
    text = d.wholeJob
      ? `The whole job — the cam, the parts it needs, labour and the tune — comes to about ${dollarsAndCents(d.jobCents)} before tax; no budget was given.`
      : `The cam lists at ${dollars(d.priceCents)}; no budget was given.`;
  } else if (d.wholeJob) {
    // The same number the shortlist, the customer's result and the quote's pre-tax total show.
    const share = (d.jobCents / d.budgetCents) * 100;
    text = `The whole job — the cam, the parts it needs, labour and the tune — comes to about ${dollarsAndCents(d.jobCents)} before tax, ${pct(share)} of your ${dollars(d.budgetCents)} budget.`;
  } else if (d.partsPriced) {
    const share = (d.jobCents / d.budgetCents) * 100;
    text = `The cam and the parts it needs come to about ${dollars(d.jobCents)}, ${pct(share)} of your ${dollars(d.budgetCents)} budget before labour.`;
  } else {
    const share = (d.priceCents / d.budgetCents) * 100;
    const room =
      d.score >= 80
        ? ', leaving room for springs, labour and the tune'
        : d.score > 0
          ? ', which leaves little for springs, labour and the tune'
          : ', more than the budget allows once labour and the tune are added';
    text = `The cam lists at ${dollars(d.priceCents)}, about ${pct(share)} of your ${dollars(d.budgetCents)} budget${room}.`;
  }
  return { subscore: 'cost', text };
}
