import type { SignOffReadings, SignOffWarning } from './sign-off-limits';
import type { BoardState, JobState } from './states';

// The job board's answers (src/lib/db/queries/job-board.ts), shared with the board's client components.

export type SignOffView = SignOffReadings & {
  tuneFile: string;
  notes: string | null;
  signedBy: string | null;
  signedAt: string;
  warnings: SignOffWarning[];
};

export type BoardJob = {
  id: number;
  number: string;
  customerName: string;
  vehicleLabel: string;
  camName: string | null;
  state: BoardState;
  nextStates: readonly JobState[];
  bookedFor: string | null;
  bay: number | null;
  technician: { id: number; name: string } | null;
  /** 0 until the job is first booked. */
  version: number;
  stateChangedAt: string | null;
  due: 'overdue' | 'today' | null;
  deactivationActive: boolean;
  signOff: SignOffView | null;
};
