import type { Sequelize } from 'sequelize';
import { seededRandom } from '../../lib/seeded-random';

// Invented rows for the scale database: names from made-up syllables, dates over three years, every
// state a quote or lead can be in. Build profiles are the demo builds' own (they pass the schema);
// cams are the demo grinds cloned under invented SKUs with their figures nudged.

export type ScaleSize = {
  customers: number;
  quotes: number;
  linesPerQuote: number;
  payments: number;
  leads: number;
  cams: number;
  dynoRuns: number;
};

export const SIZES: Record<'M' | 'L', ScaleSize> = {
  M: { customers: 10_000, quotes: 20_000, linesPerQuote: 9, payments: 5_000, leads: 5_000, cams: 200, dynoRuns: 5_000 },
  L: {
    customers: 100_000,
    quotes: 200_000,
    linesPerQuote: 9,
    payments: 50_000,
    leads: 50_000,
    cams: 2_000,
    dynoRuns: 50_000,
  },
};

const SYL = [
  'ka',
  'vel',
  'dor',
  'min',
  'tas',
  'ro',
  'quil',
  'bre',
  'sen',
  'ul',
  'fa',
  'mor',
  'ith',
  'wen',
  'ga',
  'lio',
];
const BODIES = [
  'crew-cab pickup',
  'regular-cab pickup',
  'coupe',
  'wagon',
  'long-bed work truck',
  'sedan',
  'utility wagon',
];
const QUOTE_STATES = ['draft', 'sent', 'sent', 'accepted', 'deposit-paid', 'declined', 'expired', 'cancelled'] as const;
const LEAD_STATES = ['new', 'contacted', 'quoted', 'closed'] as const;
const DAY = 86_400_000;

const sqlTime = (ms: number) => new Date(ms).toISOString().slice(0, 19).replace('T', ' ');
const cap = (s: string) => s[0].toUpperCase() + s.slice(1);

export class ScaleWriter {
  private rnd = seededRandom(2026);
  constructor(
    private db: Sequelize,
    private now = Date.now(),
  ) {}

  private pick<T>(list: readonly T[]): T {
    return list[Math.floor(this.rnd() * list.length)];
  }
  private word(parts: number) {
    return cap(Array.from({ length: parts }, () => this.pick(SYL)).join(''));
  }
  private when() {
    return this.now - Math.floor(this.rnd() * 3 * 365 * DAY);
  }

  /** Multi-row INSERTs of 1,000, each in its own transaction (a crash leaves whole chunks, never half rows). */
  async insert(table: string, columns: string[], rows: unknown[][]) {
    for (let i = 0; i < rows.length; i += 1_000) {
      const values = rows
        .slice(i, i + 1_000)
        .map((r) => `(${r.map((v) => this.db.escape(v as string)).join(',')})`)
        .join(',');
      await this.db.transaction((t) =>
        this.db.query(`INSERT INTO ${table} (${columns.join(',')}) VALUES ${values}`, { transaction: t }),
      );
    }
  }

  private async ids(sql: string): Promise<number[]> {
    const [rows] = await this.db.query(sql);
    return (rows as { id: number }[]).map((r) => Number(r.id));
  }

  async cams(count: number) {
    const [rows] = await this.db.query('SELECT * FROM cams WHERE is_factory_baseline = 0 ORDER BY id');
    const base = rows as Record<string, unknown>[];
    const columns = Object.keys(base[0]).filter((c) => c !== 'id');
    const made = Array.from({ length: Math.max(0, count - base.length) }, (_, i) => {
      const from = base[i % base.length];
      const nudge = (i % 9) - 4;
      return columns.map((c) =>
        c === 'sku'
          ? `SC-${String(i + 1).padStart(4, '0')}`
          : c === 'name'
            ? `${this.word(2)} ${Number(from.intake_duration_050) + nudge}`
            : c === 'intake_duration_050' || c === 'exhaust_duration_050'
              ? Number(from[c]) + nudge
              : from[c] instanceof Date
                ? sqlTime((from[c] as Date).getTime())
                : from[c],
      );
    });
    await this.insert('cams', columns, made);
    return this.ids('SELECT id FROM cams WHERE is_factory_baseline = 0 AND active = 1');
  }

  async customersAndBuilds(count: number) {
    const [demo] = await this.db.query('SELECT profile, baseline_cam_id AS cam FROM builds ORDER BY id');
    const profiles = demo as { profile: unknown; cam: number | null }[];
    const people = Array.from({ length: count }, (_, i) => {
      const first = this.word(2);
      const last = this.word(3);
      const at = sqlTime(this.when());
      return [
        `${first} ${last}`,
        `${first}.${last}${i}@example.test`.toLowerCase(),
        `555-${String(i % 10_000).padStart(4, '0')}`,
        at,
        at,
      ];
    });
    await this.insert('customers', ['name', 'email', 'phone', 'created_at', 'updated_at'], people);
    const customerIds = await this.ids("SELECT id FROM customers WHERE email LIKE '%@example.test' ORDER BY id");
    await this.insert(
      'builds',
      ['customer_id', 'vehicle_label', 'profile', 'baseline_cam_id', 'created_at', 'updated_at'],
      customerIds.map((id, i) => {
        const p = profiles[i % profiles.length];
        const at = people[i][3];
        return [
          id,
          `${1998 + (i % 27)} ${this.pick(BODIES)}`,
          JSON.stringify(this.varied(typeof p.profile === 'string' ? JSON.parse(p.profile) : p.profile)),
          p.cam,
          at,
          at,
        ];
      }),
    );
    const builds = await this.ids(
      "SELECT b.id FROM builds b JOIN customers c ON c.id = b.customer_id WHERE c.email LIKE '%@example.test' ORDER BY b.customer_id",
    );
    return customerIds.map((id, i) => ({ customerId: id, buildId: builds[i] }));
  }

  /** A demo profile with its engine resized (230–460 in³, 190–320 cfm), so the builds are not three engines repeated. */
  private varied(profile: { engine: Record<string, unknown> }) {
    const r3 = (n: number) => Math.round(n * 1000) / 1000;
    return {
      ...profile,
      engine: {
        ...profile.engine,
        boreIn: r3(3.6 + this.rnd() * 0.55),
        strokeIn: r3(3.25 + this.rnd() * 0.75),
        intakeFlowCfm: Math.round(190 + this.rnd() * 130),
      },
    };
  }

  /**
   * A before and an after pull (curves, SAE J1349 air) on count / 2 builds, then dyno_gains filed from them
   * by the app's own code. The after pull gains more at the top than at the bottom, by the cam's number.
   */
  async dynoRuns(count: number, owners: { buildId: number }[], camIds: number[]) {
    const grid = Array.from({ length: 15 }, (_, i) => 2500 + i * 250);
    const pull = (peakLbFt: number, gainAt: (rpm: number) => number) => {
      const curve = grid.map((rpm) => {
        const shape = 1 - ((rpm - 4000) / 4000) ** 2; // torque peaks at 4,000 rpm
        return { rpm, torqueLbFt: Math.round(peakLbFt * shape * (1 + gainAt(rpm) / 100) * 10) / 10, hp: 0 };
      });
      for (const point of curve) point.hp = (point.torqueLbFt * point.rpm) / 5252; // definition of horsepower
      const hpAt = curve.reduce((a, b) => (b.hp > a.hp ? b : a));
      const tqAt = curve.reduce((a, b) => (b.torqueLbFt > a.torqueLbFt ? b : a));
      return { curve, peakHp: hpAt.hp, peakHpRpm: hpAt.rpm, peakTorqueLbFt: tqAt.torqueLbFt, peakTorqueRpm: tqAt.rpm };
    };
    const builds = owners.slice(0, Math.floor(count / 2));
    const rows: unknown[][] = [];
    for (const { buildId } of builds) {
      const cam = this.pick(camIds);
      const peak = 280 + this.rnd() * 200;
      const top = 4 + (cam % 13);
      const at = this.when();
      for (const [phase, gainAt, when] of [
        ['before', () => 0, at],
        ['after', (rpm: number) => -4 + ((rpm - 2500) / 3500) * (top + 4), at + DAY],
      ] as const) {
        const p = pull(peak, gainAt);
        rows.push([
          buildId,
          phase === 'after' ? cam : null,
          phase,
          sqlTime(when),
          'sae-j1349',
          25,
          99,
          40,
          p.peakHp,
          p.peakHpRpm,
          p.peakTorqueLbFt,
          p.peakTorqueRpm,
          JSON.stringify(p.curve),
          sqlTime(when),
          sqlTime(when),
        ]);
      }
    }
    await this.insert(
      'dyno_runs',
      [
        'build_id',
        'cam_id',
        'phase',
        'run_at',
        'correction_standard',
        'air_temp_c',
        'baro_kpa',
        'humidity_pct',
        'peak_hp',
        'peak_hp_rpm',
        'peak_torque_lb_ft',
        'peak_torque_rpm',
        'curve',
        'created_at',
        'updated_at',
      ],
      rows,
    );
    return rows.length;
  }

  async quotes(size: ScaleSize, owners: { customerId: number; buildId: number }[], camIds: number[]) {
    const [parts] = await this.db.query('SELECT id, price_cents AS price FROM parts ORDER BY id');
    const partList = parts as { id: number; price: number }[];
    const perYear = new Map<number, number>();
    const rows: unknown[][] = [];
    const lines: unknown[][] = [];
    // Written oldest first, as a shop writes them: ids follow created_at, as they do in a real table.
    const drafts = Array.from({ length: size.quotes }, () => ({
      created: this.when(),
      owner: this.pick(owners),
      status: this.pick(QUOTE_STATES),
      total: 60_000 + Math.floor(this.rnd() * 250_000),
      cam: this.pick(camIds),
      changedDays: Math.floor(this.rnd() * 30),
    }));
    drafts.sort((a, b) => a.created - b.created);
    for (const { created, owner, status, total, cam, changedDays } of drafts) {
      const year = new Date(created).getUTCFullYear();
      const seq = (perYear.get(year) ?? 0) + 1;
      perYear.set(year, seq);
      rows.push([
        `Q-${year}-${String(seq).padStart(5, '0')}`,
        owner.customerId,
        owner.buildId,
        cam,
        status,
        total,
        825,
        Math.round(total * 0.0825),
        total + Math.round(total * 0.0825),
        Math.round(total / 5),
        status === 'draft' ? null : sqlTime(created + 3_600_000),
        sqlTime(created),
        sqlTime(created + changedDays * DAY),
      ]);
    }
    await this.insert(
      'quotes',
      [
        'number',
        'customer_id',
        'build_id',
        'cam_id',
        'status',
        'subtotal_cents',
        'tax_rate_bp',
        'tax_cents',
        'total_cents',
        'deposit_cents',
        'sent_at',
        'created_at',
        'updated_at',
      ],
      rows,
    );
    const [made] = await this.db.query(
      "SELECT id, cam_id AS cam, status, deposit_cents AS deposit, created_at AS at FROM quotes WHERE number REGEXP '^Q-[0-9]{4}-[0-9]{5}$' ORDER BY id",
    );
    const quotes = made as { id: number; cam: number; status: string; deposit: number; at: Date }[];
    for (const q of quotes) {
      const at = sqlTime(new Date(q.at).getTime());
      lines.push([q.id, 'cam', q.cam, null, 'Camshaft', '1.00', 30_000, 30_000, 0, at, at]);
      for (let k = 1; k < size.linesPerQuote; k++) {
        const part = this.pick(partList);
        lines.push([q.id, 'part', null, part.id, 'Part', '1.00', part.price, part.price, k, at, at]);
      }
    }
    await this.insert(
      'quote_lines',
      [
        'quote_id',
        'kind',
        'cam_id',
        'part_id',
        'description',
        'quantity',
        'unit_price_cents',
        'total_cents',
        'sort_order',
        'created_at',
        'updated_at',
      ],
      lines,
    );
    // Deposits on the paid quotes; the rest of the count are checkouts opened on sent quotes and left to lapse.
    const paid = quotes.filter((q) => q.status === 'deposit-paid').slice(0, size.payments);
    const lapsed = quotes.filter((q) => q.status === 'sent').slice(0, Math.max(0, size.payments - paid.length));
    await this.insert(
      'payments',
      [
        'quote_id',
        'provider_session_id',
        'amount_cents',
        'refunded_cents',
        'status',
        'paid_at',
        'created_at',
        'updated_at',
      ],
      [
        ...paid.map((q, i) => {
          const at = sqlTime(new Date(q.at).getTime() + 2 * DAY);
          return [
            q.id,
            `cs_scale_${q.id}`,
            q.deposit,
            i % 10 === 0 ? 1_000 : 0,
            i % 10 === 0 ? 'partially-refunded' : 'paid',
            at,
            at,
            at,
          ];
        }),
        ...lapsed.map((q) => {
          const at = sqlTime(new Date(q.at).getTime() + DAY);
          return [q.id, `cs_scale_${q.id}`, q.deposit, 0, 'expired', null, at, at];
        }),
      ],
    );
    return { quotes: quotes.length, lines: lines.length, payments: paid.length + lapsed.length };
  }

  async leads(count: number) {
    const answers = {
      engine: '5.3',
      use: 'towing',
      idle: 'smooth',
      emissions: 'yes',
      transmission: 'automatic',
      driveline: 'stock',
      exhaust: 'stock',
      budget: 'unsure',
      consent: true,
    };
    await this.insert(
      'leads',
      ['name', 'email', 'answers', 'status', 'created_at', 'updated_at'],
      Array.from({ length: count }, (_, i) => {
        const at = sqlTime(this.when());
        const name = `${this.word(2)} ${this.word(3)}`;
        return [name, `lead${i}@example.test`, JSON.stringify({ ...answers, name }), this.pick(LEAD_STATES), at, at];
      }),
    );
  }
}
