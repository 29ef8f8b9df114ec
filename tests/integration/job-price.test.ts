import { QueryTypes, type Sequelize } from 'sequelize';
import { signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { DEMO } from '../support/demo';
import { editableLine } from '../support/quote-fixtures';
import type { ShopRankingEntry } from '@/lib/ranking/types';
import type { QuoteLineRecord } from '@/lib/quotes/types';

// Issue 12, item 1, over HTTP against the real build and MariaDB: the shortlist for the demo 5.3 L
// pickup (seeded build 1: installed springs good to 0.500", a truck) says what the job costs before
// tax; a quote drafted from it carries that very number, with the truck cam swap and the springs.
const BUILD_ID = DEMO.builds.whitlockTowingTruck;
const RB_198 = DEMO.cams.towBoss198; // Ridgeback Tow Boss 198: $369.00, lift 0.525", deactivation-compatible
const LABOR_RATE = 13_500; // the demo shop's $135.00 an hour

type Ranking = ShopRankingEntry;
type Line = QuoteLineRecord;

let sequelize: Sequelize;
let counter: Awaited<ReturnType<typeof signedInAgent>>;
const madeQuotes: number[] = [];

beforeAll(async () => {
  sequelize = connectTestDatabase();
  counter = await signedInAgent('counter');
});
afterAll(async () => {
  // Leave the database as we found it: our drafts, their lines and their audit rows.
  if (madeQuotes.length) {
    await sequelize.query("DELETE FROM audit_log WHERE entity_type = 'quote' AND entity_id IN (?)", {
      replacements: [madeQuotes.map(String)],
    });
    await sequelize.query('DELETE FROM quote_lines WHERE quote_id IN (?)', { replacements: [madeQuotes] });
    await sequelize.query('DELETE FROM quotes WHERE id IN (?)', { replacements: [madeQuotes] });
  }
  await disconnectTestDatabase();
});

async function storedProfile(): Promise<Record<string, unknown>> {
  const [row] = await sequelize.query<{ profile: string | object; profile_schema_version: number }>(
    'SELECT profile, profile_schema_version FROM builds WHERE id = ?',
    { replacements: [BUILD_ID], type: QueryTypes.SELECT },
  );
  expect(row.profile_schema_version).toBe(2);
  return (typeof row.profile === 'string' ? JSON.parse(row.profile) : row.profile) as Record<string, unknown>;
}

const money = (cents: number) =>
  `$${Math.floor(cents / 100).toLocaleString('en-US')}.${String(cents % 100).padStart(2, '0')}`;
const itemCodes = (r: Ranking) => r.neededItems.map((i) => i.part?.sku ?? i.laborOperation?.code);

describe('one job price from the shortlist to the quote (5.3 L pickup)', () => {
  let rankings: Ranking[];

  beforeAll(async () => {
    const profile = await storedProfile();
    expect((profile.vehicle as { class?: string }).class).toBe('truck');
    const ranked = await counter.post('/api/advisor/rank').send({ build: profile, includeCurves: false });
    expect(ranked.status).toBe(200);
    expect(ranked.body.vehicleClass).toBe('truck');
    rankings = ranked.body.rankings;
  });

  it('every shortlist row is its cam plus its needed items, and every cam is fitted with the truck cam swap', () => {
    for (const r of rankings) {
      expect(r.jobPriceCents).toBe(r.camPriceCents + r.neededItems.reduce((s, i) => s + i.priceCents, 0));
      expect(r.needs.map((n) => n.kind)).toEqual(expect.arrayContaining(['install', 'tune']));
      expect(itemCodes(r)).toContain('CAM-TRUCK');
      expect(itemCodes(r)).not.toContain('CAM-CAR');
      // The cost reason's "about $X" is the same number, to the cent.
      expect(r.reasons.find((x) => x.subscore === 'cost')?.text).toContain(
        `about ${money(r.jobPriceCents!)} before tax`,
      );
    }
  });

  it('the advisor’s spring verdict and the quote’s spring kit agree: a 0.525" cam past the 0.500" springs', () => {
    const r = rankings.find((x) => x.camId === RB_198)!;
    expect(r.reasons.find((x) => x.subscore === 'fit')?.text).toMatch(
      /Lift 0\.525" is past your installed springs' 0\.500" limit — it needs springs/,
    );
    // The lowest-rated demo kit good to 0.525": the 0.570" one, not the rule's own 0.600" kit.
    expect(itemCodes(r)).toEqual(expect.arrayContaining(['SPR-570', 'SPR-INST']));
    expect(itemCodes(r)).not.toContain('SPR-600');
  });

  it('each cam gets the spring kit rated for its lift: low-lift and high-lift cams get different kits', () => {
    // The demo's rated kits, as the seeder lists them (partRows, spec maxLiftIn).
    const rated = [
      ['SPR-570', 0.57],
      ['SPR-600', 0.6],
      ['SPR-660', 0.66],
    ] as const;
    const kitsUsed = new Set<string>();
    for (const r of rankings) {
      const liftIn = r.needs.find((n) => n.kind === 'springs')?.minLiftIn;
      const kits = r.neededItems.filter((i) => i.rule.kind === 'springs' && i.type === 'part');
      if (liftIn === undefined) {
        expect(kits).toEqual([]);
        continue;
      }
      const expected = rated.find(([, maxIn]) => liftIn <= maxIn)![0];
      expect([r.camId, kits.map((k) => k.part?.sku)]).toEqual([r.camId, [expected]]);
      expect(kits[0].warning).toBeUndefined();
      kitsUsed.add(expected);
    }
    expect(kitsUsed.size).toBeGreaterThanOrEqual(2);
  });

  it('hand-worked: RB-198 for this truck is $369 + 8 h swap $1,080 + gaskets $39 + springs $289 + 2 h $270 + tune $495 + 3 h $405 = $2,947.00', () => {
    const r = rankings.find((x) => x.camId === RB_198)!;
    // Only when the advisor names no converter for it (a 2,000 rpm stall; it is a mild cam).
    expect(r.needs.map((n) => n.kind)).toEqual(['install', 'springs', 'tune']);
    expect(r.jobPriceCents).toBe(36_900 + 8 * LABOR_RATE + 3_900 + 28_900 + 2 * LABOR_RATE + 49_500 + 3 * LABOR_RATE);
    expect(r.jobPriceCents).toBe(294_700);
  });

  it('a draft made from the shortlist totals the shortlist’s job price before tax, with install labour and springs', async () => {
    // The cam the counter would pick: the best-ranked one whose lift needs springs.
    const chosen = rankings.filter((x) => x.needs.some((n) => n.kind === 'springs')).sort((a, b) => a.rank - b.rank)[0];
    expect(chosen).toBeDefined();
    for (const camId of [...new Set([chosen.camId, RB_198])]) {
      const shortlisted = rankings.find((x) => x.camId === camId)!;
      const res = await counter.post('/api/quotes').send({ buildId: BUILD_ID, camId });
      expect(res.status).toBe(201);
      madeQuotes.push(res.body.id);
      const lines = res.body.lines as Line[];
      expect(res.body.subtotalCents).toBe(shortlisted.jobPriceCents);
      expect(lines.reduce((s, l) => s + l.totalCents, 0)).toBe(shortlisted.jobPriceCents);
      // Cam-install labour by vehicle class: the truck swap, 8 h at the shop rate.
      expect(lines.find((l) => l.kind === 'labor' && l.laborOperationId === DEMO.labor.camSwapTruck)).toMatchObject({
        quantity: 8,
        unitPriceCents: LABOR_RATE,
        totalCents: 108_000,
      });
      const kit = shortlisted.neededItems.find((i) => i.rule.kind === 'springs' && i.type === 'part')!.part!.sku;
      expect(lines.find((l) => l.kind === 'part' && l.description.startsWith(`${kit} `))).toBeDefined();
      expect(lines.find((l) => l.kind === 'labor' && l.laborOperationId === DEMO.labor.springInstall)).toMatchObject({
        quantity: 2,
        totalCents: 27_000,
      });
      // Tax on the goods only (cam and parts), 8.25 %, half up; the tune and labour untaxed.
      const goods = lines.filter((l) => ['cam', 'part'].includes(l.kind)).reduce((s, l) => s + l.totalCents, 0);
      expect(res.body.taxCents).toBe(Math.floor((goods * 825 + 5_000) / 10_000));
      expect(res.body.totalCents).toBe(shortlisted.jobPriceCents + res.body.taxCents);
    }
    // RB-198 by hand: goods $369 + $39 + $289 = $697 → tax $57.50; total $3,004.50.
    const rb = await counter.get(`/api/quotes/${madeQuotes.at(-1)}`);
    expect(rb.body).toMatchObject({ subtotalCents: 294_700, taxCents: 5_750, totalCents: 300_450 });
  });

  it('the draft warns when its spring kit does not cover the cam’s lift, and names the kit that does', async () => {
    const manager = await signedInAgent('manager');
    const res = await counter.post('/api/quotes').send({ buildId: BUILD_ID, camId: DEMO.cams.fullSend235 });
    expect(res.status).toBe(201);
    madeQuotes.push(res.body.id);
    const draft = res.body as { id: number; version: number; lines: Line[] };
    // LV-235 lifts 0.640": the 0.660" kit, and the page has nothing to say about springs.
    expect(draft.lines.find((l) => l.partId === DEMO.parts.dualSprings660)).toBeDefined();
    expect((await manager.get(`/quotes/${draft.id}`)).text).not.toContain('Springs: check the kit');

    // Someone puts the 0.600" kit in by hand: the page says it is short and which kit covers the lift.
    const lines = draft.lines.map((l) =>
      l.partId === DEMO.parts.dualSprings660
        ? {
            ...editableLine(l),
            partId: DEMO.parts.ovateSprings600,
            description: 'SPR-600 Ovate-wire spring kit, 0.600" max lift',
            unitPriceCents: 34_900,
          }
        : editableLine(l),
    );
    const saved = await manager.patch(`/api/quotes/${draft.id}`).send({ version: draft.version, lines });
    expect(saved.status).toBe(200);
    const page = (await manager.get(`/quotes/${draft.id}`)).text;
    expect(page).toContain('Springs: check the kit before this quote goes out');
    expect(page).toContain('SPR-600 is rated to 0.600&quot;, below the cam&#x27;s 0.640&quot; valve lift: SPR-660');
  });
});
