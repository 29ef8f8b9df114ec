import 'server-only';
import { Build } from '../models';

// The stored side of a quote's snapshot (src/lib/quotes/snapshot.ts freezes it at the first send, ranking the
// quoted cam itself: the query layer never calls the ranking), and reading JSON columns back.

/** The build's profile as it stands now, parsed; null when there is no such build. */
export async function currentBuildProfile(buildId: number): Promise<{ profile: unknown } | null> {
  const build = await Build.findByPk(buildId, { attributes: ['id', 'profile'] });
  if (!build) return null;
  return { profile: typeof build.profile === 'string' ? (JSON.parse(build.profile) as unknown) : build.profile };
}

/** MariaDB hands JSON columns back as text through this driver; read either form. */
export function readJson(value: unknown): unknown {
  if (typeof value !== 'string') return value ?? null;
  try {
    return JSON.parse(value) as unknown;
  } catch {
    return null;
  }
}
