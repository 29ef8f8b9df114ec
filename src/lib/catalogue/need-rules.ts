// What a cam needs besides itself: the manager's plain rules, evaluated without any I/O so the
// advisor (its "needs" list) and the quote builder (its lines) reach the same answer from the same rows.
// Load the rules with loadNeedRules() from '@/lib/db/queries/rules' and pass them in.

export const NEED_RULE_KIND_LIST = ['lift-over', 'deactivation-active', 'crossover-over-stall', 'always'] as const;
export type NeedRuleKindName = (typeof NEED_RULE_KIND_LIST)[number];

/** One thing a rule adds: a part, a labour operation, or both (each becomes its own need). */
export type NeedRuleItemInput = {
  partId: number | null;
  laborOperationId: number | null;
  quantity: number;
  part?: { id: number; sku: string; name: string; priceCents: number; category?: string } | null;
  laborOperation?: { id: number; code: string; name: string; hours: number } | null;
};

export type NeedRuleInput = {
  id: number;
  kind: NeedRuleKindName;
  /** lift-over: inches at the valve; crossover-over-stall: rpm; the other kinds: null. */
  threshold: number | null;
  label: string;
  active: boolean;
  items: NeedRuleItemInput[];
};

export type NeedContext = {
  cam: { intakeLiftIn: number; exhaustLiftIn: number; deactivationCompatible: boolean };
  build: {
    /** 'active' is the only state that needs a delete kit; 'none' and 'deleted' do not. */
    cylinderDeactivation: 'none' | 'active' | 'deleted' | (string & {});
    /** Converter stall; 0, null or undefined means no converter (a manual). */
    stallRpm: number | null | undefined;
  };
  /** Where the new cam starts to out-pull the one in the engine; null when there is none. */
  crossoverRpm: number | null | undefined;
};

export type Need = {
  type: 'part' | 'labor';
  partId: number | null;
  laborOperationId: number | null;
  quantity: number;
  part: NeedRuleItemInput['part'];
  laborOperation: NeedRuleItemInput['laborOperation'];
  rule: { id: number; kind: NeedRuleKindName; label: string };
  /** Why the rule fired, in words a customer can be told. */
  reason: string;
};

const inches = (n: number) => `${n.toFixed(3)}"`;
const rpm = (n: number) => `${Math.round(n).toLocaleString('en-US')} rpm`;

/** Why a rule fires for this cam and build, or null when it does not. */
export function ruleReason(rule: NeedRuleInput, context: NeedContext): string | null {
  const { cam, build, crossoverRpm } = context;
  switch (rule.kind) {
    case 'lift-over': {
      if (rule.threshold === null) return null;
      const lift = Math.max(cam.intakeLiftIn, cam.exhaustLiftIn);
      if (!(lift > rule.threshold)) return null;
      const which = cam.intakeLiftIn >= cam.exhaustLiftIn ? 'intake' : 'exhaust';
      return `The cam's ${which} lift at the valve, ${inches(lift)}, is over ${inches(rule.threshold)}.`;
    }
    case 'deactivation-active':
      if (build.cylinderDeactivation !== 'active' || cam.deactivationCompatible) return null;
      return 'The engine still has cylinder deactivation working and this cam is not made for it, so deactivation has to be deleted.';
    case 'crossover-over-stall': {
      const stall = build.stallRpm ?? 0;
      if (rule.threshold === null || crossoverRpm === null || crossoverRpm === undefined || stall <= 0) return null;
      const gap = crossoverRpm - stall;
      if (gap < rule.threshold) return null;
      return `The cam starts to out-pull the current one at ${rpm(crossoverRpm)}, ${rpm(gap)} above the converter's ${rpm(stall)} stall (the rule asks for at least ${rpm(rule.threshold)}).`;
    }
    case 'always':
      return 'Every cam swap needs this.';
    default:
      return null;
  }
}

/**
 * The parts and labour to add, each with the rule that fired and a plain reason. Inactive rules are
 * skipped. A part or labour operation asked for by several rules appears once, for the first rule
 * (rules are taken in the order given), with the largest quantity any of them asked for.
 */
export function evaluateNeedRules(rules: readonly NeedRuleInput[], context: NeedContext): Need[] {
  const needs: Need[] = [];
  const byKey = new Map<string, Need>();
  for (const rule of rules) {
    if (!rule.active) continue;
    const reason = ruleReason(rule, context);
    if (reason === null) continue;
    for (const item of rule.items) {
      const entries: Array<Pick<Need, 'type' | 'partId' | 'laborOperationId' | 'part' | 'laborOperation'>> = [];
      if (item.partId !== null) entries.push({ type: 'part', partId: item.partId, laborOperationId: null, part: item.part ?? null, laborOperation: null });
      if (item.laborOperationId !== null) {
        entries.push({ type: 'labor', partId: null, laborOperationId: item.laborOperationId, part: null, laborOperation: item.laborOperation ?? null });
      }
      for (const entry of entries) {
        const key = entry.type === 'part' ? `part:${entry.partId}` : `labor:${entry.laborOperationId}`;
        const seen = byKey.get(key);
        if (seen) {
          seen.quantity = Math.max(seen.quantity, item.quantity);
          continue;
        }
        const need: Need = { ...entry, quantity: item.quantity, rule: { id: rule.id, kind: rule.kind, label: rule.label }, reason };
        byKey.set(key, need);
        needs.push(need);
      }
    }
  }
  return needs;
}
