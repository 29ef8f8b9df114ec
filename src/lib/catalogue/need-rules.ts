// What a cam needs besides itself, in this shop's parts and labour. The advisor alone decides WHICH
// kinds of need a cam has (src/lib/advisor/needs.ts: install, springs past the installed springs'
// limit, pushrods, lifters, the deactivation delete, a converter, the tune); the manager's rules only
// say what each kind — for each vehicle class — adds here. Evaluated without I/O so the shortlist and
// the quote builder reach the same lines from the same rows. Load the rules with loadNeedRules() from
// '@/lib/db/queries/rules' and pass them in.
import type { NeedKind } from '@/lib/advisor/types';
import { NEED_KIND_LIST } from '@/lib/advisor/needs';
import type { VehicleClass } from '@/lib/schemas/build-profile';
import { NO_SPRING_KIT_COVERS, noKitCoversMessage, pickSpringKit, type SpringKit } from './spring-kits';

export const NEED_RULE_KIND_LIST = NEED_KIND_LIST;
export type NeedRuleKindName = NeedKind;

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
  /** The vehicle class the rule is for; null: every class without a rule of its own for this kind. */
  vehicleClass: VehicleClass | null;
  label: string;
  active: boolean;
  items: NeedRuleItemInput[];
};

export type NeedContext = {
  /** The advisor's typed needs for this cam and build (its reason is the one the customer is told). */
  needs: readonly { kind: NeedKind; reason: string; minLiftIn?: number }[];
  vehicleClass: VehicleClass;
  /**
   * The catalogue's rated spring kits. With them, a springs rule's kit is swapped for the one rated for the
   * cam's lift (src/lib/catalogue/spring-kits.ts); without them the rule's own kit is used as written.
   */
  springKits?: readonly SpringKit[];
};

/** Something the draft must not go out with unseen: named by code, told in words. */
export type NeedWarning = { code: typeof NO_SPRING_KIT_COVERS; message: string };

export type Need = {
  type: 'part' | 'labor';
  partId: number | null;
  laborOperationId: number | null;
  quantity: number;
  part: NeedRuleItemInput['part'];
  laborOperation: NeedRuleItemInput['laborOperation'];
  rule: { id: number; kind: NeedRuleKindName; label: string; vehicleClass: VehicleClass | null };
  /** Why the rule fired: the advisor's reason for the need, in words a customer can be told. */
  reason: string;
  /** Set when the shop's catalogue cannot do what the need asks (no spring kit rated for the lift). */
  warning?: NeedWarning;
};

type PartEntry = { part: NeedRuleItemInput['part']; partId: number; warning?: NeedWarning };

/** A springs rule's rated kit becomes the kit rated for the lift; other parts stay as the rule names them. */
function springKitFor(item: NeedRuleItemInput & { partId: number }, context: NeedContext): PartEntry {
  const asWritten: PartEntry = { part: item.part ?? null, partId: item.partId };
  const kits = context.springKits;
  const liftIn = context.needs.find((n) => n.kind === 'springs')?.minLiftIn;
  if (!kits || liftIn === undefined || !kits.some((kit) => kit.id === item.partId)) return asWritten;
  const kit = pickSpringKit(kits, liftIn);
  if (kit) {
    const { maxLiftIn: _rated, ...part } = kit;
    void _rated;
    return { part: { ...part, category: kit.category ?? 'springs' }, partId: kit.id };
  }
  const bestIn = kits.reduce<number | null>(
    (best, k) => (best === null || k.maxLiftIn > best ? k.maxLiftIn : best),
    null,
  );
  return {
    ...asWritten,
    warning: { code: NO_SPRING_KIT_COVERS, message: noKitCoversMessage(liftIn, item.part ?? null, bestIn) },
  };
}

/**
 * The active rules that apply to one need kind for one vehicle class: the rules written for that class
 * when there are any, else the ones for every class (a "truck" install rule overrides the general one).
 */
export function rulesFor(rules: readonly NeedRuleInput[], kind: NeedKind, vehicleClass: VehicleClass): NeedRuleInput[] {
  const ofKind = rules.filter((r) => r.active && r.kind === kind);
  const own = ofKind.filter((r) => r.vehicleClass === vehicleClass);
  return own.length ? own : ofKind.filter((r) => r.vehicleClass === null);
}

/**
 * The parts and labour to add, each with the rule that fired and the advisor's reason. Rules are taken
 * in the order given. A part or labour operation asked for by several rules appears once, for the first
 * rule, with the largest quantity any of them asked for.
 */
export function evaluateNeedRules(rules: readonly NeedRuleInput[], context: NeedContext): Need[] {
  const reasons = new Map<NeedKind, string>();
  for (const need of context.needs) if (!reasons.has(need.kind)) reasons.set(need.kind, need.reason);
  const firing = new Set<number>();
  for (const kind of reasons.keys())
    for (const rule of rulesFor(rules, kind, context.vehicleClass)) firing.add(rule.id);

  const needs: Need[] = [];
  const byKey = new Map<string, Need>();
  for (const rule of rules) {
    if (!firing.has(rule.id)) continue;
    const reason = reasons.get(rule.kind)!;
    for (const item of rule.items) {
      const entries: Array<Pick<Need, 'type' | 'partId' | 'laborOperationId' | 'part' | 'laborOperation' | 'warning'>> =
        [];
      if (item.partId !== null) {
        const chosen =
          rule.kind === 'springs'
            ? springKitFor({ ...item, partId: item.partId }, context)
            : { part: item.part ?? null, partId: item.partId };
        entries.push({ type: 'part', laborOperationId: null, laborOperation: null, ...chosen });
      }
      if (item.laborOperationId !== null) {
        entries.push({
          type: 'labor',
          partId: null,
          laborOperationId: item.laborOperationId,
          part: null,
          laborOperation: item.laborOperation ?? null,
        });
      }
      for (const entry of entries) {
        const key = entry.type === 'part' ? `part:${entry.partId}` : `labor:${entry.laborOperationId}`;
        const seen = byKey.get(key);
        if (seen) {
          seen.quantity = Math.max(seen.quantity, item.quantity);
          continue;
        }
        const need: Need = {
          ...entry,
          quantity: item.quantity,
          rule: { id: rule.id, kind: rule.kind, label: rule.label, vehicleClass: rule.vehicleClass },
          reason,
        };
        byKey.set(key, need);
        needs.push(need);
      }
    }
  }
  return needs;
}

/** Need kinds with no active rule for a vehicle class: jobs of that class would be quoted without them. */
export function unmappedKinds(rules: readonly NeedRuleInput[], vehicleClass: VehicleClass): NeedKind[] {
  return NEED_KIND_LIST.filter((kind) => rulesFor(rules, kind, vehicleClass).length === 0);
}
