import type { Correction } from './correction';
import type { DynoType } from './dyno-type';
import type { PullPoint } from './figures';

// A dyno run as the API and the job page show it (src/lib/db/queries/dyno-runs.ts writes and reads them).

export type DynoRunView = {
  id: number;
  buildId: number;
  quoteId: number | null;
  camId: number | null;
  camName: string | null;
  phase: 'before' | 'after';
  dynoType: DynoType;
  runAt: string;
  recordedBy: string | null;
  air: { airTempC: number | null; baroKpa: number | null; humidityPct: number | null };
  correction: Correction | null;
  observed: {
    peakHp: number | null;
    peakHpRpm: number | null;
    peakTorqueLbFt: number | null;
    peakTorqueRpm: number | null;
  };
  corrected: { peakHp: number | null; peakTorqueLbFt: number | null } | null;
  curve: PullPoint[] | null;
  correctedCurve: PullPoint[] | null;
  notes: string | null;
};
