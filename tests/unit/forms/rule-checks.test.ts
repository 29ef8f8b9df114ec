import { ruleChecks } from '@/lib/forms/rule-checks';
import { NEED_RULE_LIMITS, NeedRuleSchema } from '@/lib/schemas/need-rule';
import { expectSameVerdict, zodErrors } from '../../support/zod-errors';

// The rule form's yup checks against the zod schema POST /api/rules uses: the same payloads, the same fields
// flagged in the same words.

type Item = { partId: number | null; laborOperationId: number | null; quantity: number };
type Payload = { kind: string; vehicleClass: string | null; label: string; active: boolean; items: Item[] };
const good: Payload = {
  kind: 'springs',
  vehicleClass: null,
  label: 'Spring kit and fitting',
  active: true,
  items: [{ partId: 3, laborOperationId: null, quantity: 1 }],
};

const cases: [string, Payload, string[]][] = [
  ['a blank label', { ...good, label: '  ' }, ['label']],
  ['a label past its length', { ...good, label: 'x'.repeat(NEED_RULE_LIMITS.labelMaxLength + 1) }, ['label']],
  [
    'an item with neither part nor labour',
    { ...good, items: [{ partId: null, laborOperationId: null, quantity: 1 }] },
    ['items.0.partId'],
  ],
  [
    'a quantity that is not a number',
    { ...good, items: [{ partId: 3, laborOperationId: null, quantity: Number('a') }] },
    ['items.0.quantity'],
  ],
  [
    'a quantity past the limit on the second item',
    { ...good, items: [good.items[0], { partId: null, laborOperationId: 4, quantity: 100 }] },
    ['items.1.quantity'],
  ],
  ['no items', { ...good, items: [] }, ['items']],
  [
    'too many items',
    { ...good, items: Array.from({ length: NEED_RULE_LIMITS.items + 1 }, () => good.items[0]) },
    ['items'],
  ],
];

describe('rule checks: yup in the browser, zod on the server', () => {
  it('passes a sensible rule both ways', () => {
    expect(zodErrors(NeedRuleSchema, good)).toEqual({});
    expect(ruleChecks(good)).toEqual({});
  });

  it.each(cases)('%s: the same fields, in the same words', (_name, payload, flagged) => {
    expectSameVerdict(NeedRuleSchema, ruleChecks, payload, flagged);
  });
});
