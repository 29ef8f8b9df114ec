import { z } from 'zod';
import { text } from './text';

// The date range every report takes: ?from=YYYY-MM-DD&to=YYYY-MM-DD, both days included, in UTC
// (the database keeps UTC). Left out, the range is the last 30 days ending today.
export const REPORT_LIMITS = { defaultDays: 30, maxDays: 366 } as const;

const DAY_MS = 86_400_000;

/** A real calendar day as YYYY-MM-DD (2026-02-30 is refused, not rolled over). */
function isCalendarDay(value: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(value)) return false;
  const d = new Date(`${value}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === value;
}

const day = (label: string) =>
  text(label, { error: `${label} must be a date like 2026-11-30` })
    .refine(isCalendarDay, { error: `${label} must be a real date written YYYY-MM-DD, like 2026-11-30` })
    .optional();

export const utcDay = (d: Date) => d.toISOString().slice(0, 10);
export const addDays = (isoDay: string, days: number) =>
  utcDay(new Date(Date.parse(`${isoDay}T00:00:00Z`) + days * DAY_MS));

/** Days from `from` to `to`, both included: the same day twice is 1. */
export function daysInRange(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / DAY_MS) + 1;
}

export type ReportRange = { from: string; to: string; days: number };

/** Builds the schema against a given "today" so tests and the page agree on the default range. */
export function reportRangeSchema(today: () => string = () => utcDay(new Date())) {
  return z.object({ from: day('from'), to: day('to') }).transform((v, ctx): ReportRange => {
    const to = v.to ?? (v.from ? addDays(v.from, REPORT_LIMITS.defaultDays - 1) : today());
    const from = v.from ?? addDays(to, -(REPORT_LIMITS.defaultDays - 1));
    const days = daysInRange(from, to);
    if (days < 1) {
      ctx.addIssue({ code: 'custom', path: ['from'], message: `from (${from}) must be on or before to (${to})` });
      return z.NEVER;
    }
    if (days > REPORT_LIMITS.maxDays) {
      ctx.addIssue({
        code: 'custom',
        path: ['to'],
        message: `the range may be at most one year (${REPORT_LIMITS.maxDays} days); ${from} to ${to} is ${days} days`,
      });
      return z.NEVER;
    }
    return { from, to, days };
  });
}

export const ReportRangeSchema = reportRangeSchema();
