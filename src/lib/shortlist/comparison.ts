import type { CamRanking, NeedKind } from '@/lib/advisor';
import { IDLE_VACUUM, idleCharacter, type IdleCharacter } from '@/lib/advisor/idle';
import { LOW_END_TOP_RPM } from '@/lib/advisor/curve';
import { deg, formatMoney, formatNumber, hpText, inches, pctText } from '@/lib/format';

// The side-by-side comparison of the two or three cams the counter person chose, as text. Every figure is
// the advisor's own (the ranking answer: the cam card's specs, valve events, dynamic compression, idle
// vacuum, needs) and the price is the ranking's jobPriceCents, the one job price the shortlist and a quote
// show. Nothing is worked out again here: this only puts those numbers into words and units.

/** A ranking entry as the shortlist holds it: the advisor's result plus the shop's whole-job price. */
export type ComparedCam = CamRanking & { jobPriceCents: number | null; emissionsCertified: boolean };

export const COMPARE_MIN = 2;
export const COMPARE_MAX = 3;

export type ComparisonRow = { key: string; label: string; values: string[] };
export type ComparisonGroup = { key: string; title: string; rows: ComparisonRow[] };

/** An event angle said the way a person reads a cam card: a negative IVO opens after TDC, not "−2° before". */
function eventText(value: number, before: string, after: string): string {
  return value < 0 ? `${deg(-value)} ${after}` : `${deg(value)} ${before}`;
}

/** Overlap at 0.050" is often below zero on street cams: say what that means instead of showing a bare minus. */
function overlapText(overlapDeg: number): string {
  return overlapDeg < 0 ? `None at 0.050" (${deg(overlapDeg).replace('-', '−')})` : deg(overlapDeg);
}

const IDLE_WORDS: Record<IdleCharacter, string> = {
  smooth: 'Smooth, close to how it idles now',
  noticeable: 'A light lope you can hear',
  aggressive: 'A big, choppy lope',
};

/** What a need adds to the job, in a word or two for a table cell (the customer view tells each in full). */
export function needLabel(kind: NeedKind, suggestedStallRpm?: number): string {
  switch (kind) {
    case 'install':
      return 'Fitting';
    case 'springs':
      return 'Stronger valve springs';
    case 'pushrods':
      return 'Pushrods';
    case 'lifters':
      return 'Lifters';
    case 'deactivation-delete':
      return 'Cylinder-shutdown delete';
    case 'converter':
      return suggestedStallRpm
        ? `Converter (about ${formatNumber(Math.round(suggestedStallRpm / 100) * 100)} rpm stall)`
        : 'Converter';
    case 'tune':
      return 'Re-tune';
  }
}

/** Idle vacuum in words, with what it means for vacuum power brakes (about 15 inHg, common practice). */
export function vacuumWords(inHg: number): string {
  const enough = inHg >= IDLE_VACUUM.brakeBoosterMinInHg;
  // Whole inHg, unless rounding would put a figure just short of the line on it ("about 15: less than 15").
  const digits = !enough && Math.round(inHg) >= IDLE_VACUUM.brakeBoosterMinInHg ? 1 : 0;
  return `About ${formatNumber(inHg, digits, 'inHg')}: ${enough ? 'enough for vacuum power brakes' : `less than the ${IDLE_VACUUM.brakeBoosterMinInHg} inHg or so vacuum power brakes want`}`;
}

/** The whole job before tax as every screen shows it; a cam without a price is priced at the counter. */
export function jobPriceText(cents: number | null): string {
  return cents === null ? 'Price at the counter' : formatMoney(cents);
}

export function comparisonGroups(cams: readonly ComparedCam[]): ComparisonGroup[] {
  const row = (key: string, label: string, value: (cam: ComparedCam) => string): ComparisonRow => ({
    key,
    label,
    values: cams.map(value),
  });
  return [
    {
      key: 'card',
      title: 'The cam card',
      rows: [
        row(
          'duration',
          'Duration at 0.050" (intake / exhaust)',
          (c) => `${deg(c.specs.intakeDuration050)} / ${deg(c.specs.exhaustDuration050)}`,
        ),
        row(
          'lift',
          'Lift at the valve (intake / exhaust)',
          (c) => `${inches(c.specs.intakeLiftIn)} / ${inches(c.specs.exhaustLiftIn)}`,
        ),
        row('lsa', 'Lobe separation angle (LSA)', (c) => deg(c.specs.lsa)),
        row('icl', 'Intake centerline, installed', (c) => deg(c.specs.intakeCenterline)),
      ],
    },
    {
      key: 'events',
      title: 'When the valves open and close (at 0.050")',
      rows: [
        row('ivo', 'Intake opens (IVO)', (c) => eventText(c.valveEvents.ivo, 'before TDC', 'after TDC')),
        row('ivc', 'Intake closes (IVC)', (c) => eventText(c.valveEvents.ivc, 'after BDC', 'before BDC')),
        row('evo', 'Exhaust opens (EVO)', (c) => eventText(c.valveEvents.evo, 'before BDC', 'after BDC')),
        row('evc', 'Exhaust closes (EVC)', (c) => eventText(c.valveEvents.evc, 'after TDC', 'before TDC')),
        row('overlap', 'Overlap: both valves open', (c) => overlapText(c.valveEvents.overlap)),
      ],
    },
    {
      key: 'driving',
      title: 'How it drives (estimates)',
      rows: [
        row('dcr', 'Dynamic compression', (c) => `${formatNumber(c.dynamicCompression, 1)}:1`),
        row('idle', 'Idle', (c) => IDLE_WORDS[idleCharacter(c.idleVacuumInHg)]),
        row('vacuum', 'Vacuum at idle', (c) => vacuumWords(c.idleVacuumInHg)),
        row(
          'peak',
          'Peak power',
          (c) => `${hpText(c.predicted.peakHp)} (${pctText(c.predicted.gainPctPeakHp)} on now)`,
        ),
        row('crossover', 'Pulls harder than the cam in it now', (c) =>
          c.crossoverRpm === null
            ? 'Not within the rev range'
            : `From about ${formatNumber(Math.round(c.crossoverRpm / 100) * 100, 0, 'rpm')}`,
        ),
        row('low', `Pulling power below ${formatNumber(LOW_END_TOP_RPM, 0, 'rpm')}`, (c) =>
          c.predicted.lowEndLossPct >= 1
            ? `Up to ${formatNumber(c.predicted.lowEndLossPct, 0, '%')} less than now`
            : 'About the same as now',
        ),
      ],
    },
    {
      key: 'job',
      title: 'The job',
      rows: [
        row(
          'needs',
          'The job includes',
          (c) => c.needs.map((n) => needLabel(n.kind, n.suggestedStallRpm)).join(', ') || 'The cam only',
        ),
        row('emissions', 'Emissions', (c) =>
          c.emissionsCertified
            ? 'Certified for emissions-tested road use'
            : 'Not certified for emissions-tested road use',
        ),
        row('price', 'Whole job before tax', (c) => jobPriceText(c.jobPriceCents)),
      ],
    },
  ];
}
