import { laborLine, lineNetCents, type QuoteLineKind } from './pricing';

// The one job price: the cam, the parts and labour the shop's rules add for what the cam needs, and the
// tune, before tax, in integer cents. The shortlist table, the advisor's cost reason, the customer's
// questionnaire result and the quote draft all come from jobLines()/jobPriceCents(), so they agree to the
// cent: the quote is drafted from the very lines priced here, rounded line by line the way the quote is.

/** What a need rule adds (src/lib/catalogue/need-rules.ts evaluates them); only the priced fields matter here. */
export type JobItem = {
  type: 'part' | 'labor';
  quantity: number;
  part?: { id: number; sku: string; name: string; priceCents: number; category?: string } | null;
  laborOperation?: { id: number; name: string; hours: number } | null;
};

/** One line of the job, in the shape a quote line is written from. */
export type JobLine = {
  kind: QuoteLineKind;
  camId: number | null;
  partId: number | null;
  laborOperationId: number | null;
  description: string;
  quantity: number;
  unitPriceCents: number;
  discountCents: number;
};

export type JobCam = { id: number; description: string; priceCents: number };

/** The line an item becomes; a part in the catalogue's tune category is a tune line (untaxed, see isTaxable). */
export function jobItemLine(item: JobItem, laborRateCents: number): JobLine | null {
  if (item.type === 'part' && item.part) {
    const p = item.part;
    return {
      kind: p.category === 'tune' ? 'tune' : 'part',
      camId: null,
      partId: p.id,
      laborOperationId: null,
      description: `${p.sku} ${p.name}`,
      quantity: item.quantity,
      unitPriceCents: p.priceCents,
      discountCents: 0,
    };
  }
  if (item.type === 'labor' && item.laborOperation) {
    const op = item.laborOperation;
    const { quantity, unitPriceCents } = laborLine(op.hours, item.quantity, laborRateCents);
    return {
      kind: 'labor',
      camId: null,
      partId: null,
      laborOperationId: op.id,
      description: op.name,
      quantity,
      unitPriceCents,
      discountCents: 0,
    };
  }
  return null;
}

/** The cam line, then one line per item, in the rules' order. */
export function jobLines(cam: JobCam, items: readonly JobItem[], laborRateCents: number): JobLine[] {
  const camLine: JobLine = {
    kind: 'cam',
    camId: cam.id,
    partId: null,
    laborOperationId: null,
    description: cam.description,
    quantity: 1,
    unitPriceCents: cam.priceCents,
    discountCents: 0,
  };
  return [camLine, ...items.map((item) => jobItemLine(item, laborRateCents)).filter((l): l is JobLine => l !== null)];
}

/** The job before tax: the sum of its lines, each rounded to the cent as the quote rounds it. */
export function jobPriceCents(lines: readonly JobLine[]): number {
  return lines.reduce((sum, line) => sum + lineNetCents(line), 0);
}
