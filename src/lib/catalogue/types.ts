// What the catalogue's query functions and API answer, in plain JSON shapes: shared by route handlers,
// pages and client components, which never import the query modules themselves.

export type CamRecord = {
  id: number;
  sku: string;
  name: string;
  supplierId: number | null;
  supplierName: string | null;
  intakeDuration050: number;
  exhaustDuration050: number;
  intakeAdvertised: number | null;
  exhaustAdvertised: number | null;
  intakeLiftIn: number;
  exhaustLiftIn: number;
  lsa: number;
  intakeCenterline: number;
  rockerRatio: number;
  springMaxLiftIn: number | null;
  deactivationCompatible: boolean;
  emissionsCertified: boolean;
  isFactoryBaseline: boolean;
  baselineForLiters: number | null;
  priceCents: number;
  costCents: number;
  stockOnHand: number;
  active: boolean;
  archivedAt: string | null;
  notes: string | null;
  version: number;
  createdAt: string;
  updatedAt: string;
};

export type SupplierOption = { id: number; name: string };
