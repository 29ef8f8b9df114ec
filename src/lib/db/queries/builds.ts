import { Build, Customer, db } from '../models';

export type BuildSummary = { id: number; vehicleLabel: string; customerName: string; profile: unknown };

/** Saved builds, newest first, with whose they are: the advisor page starts from one of these. */
export async function listBuildSummaries(limit = 50): Promise<BuildSummary[]> {
  db();
  const builds = await Build.findAll({
    include: [{ model: Customer, as: 'customer', attributes: ['name'] }],
    order: [['updatedAt', 'DESC'], ['id', 'DESC']],
    limit,
  });
  return builds.map((build) => {
    const customer = (build as Build & { customer?: Customer }).customer;
    return { id: build.id, vehicleLabel: build.vehicleLabel, customerName: customer?.name ?? 'Unknown customer', profile: build.profile };
  });
}
