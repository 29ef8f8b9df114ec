// The questionnaire's limits, shared by LeadAnswersSchema (src/lib/schemas/lead.ts, which re-exports them)
// and the form in the browser. No imports: the form reads them without pulling zod into the customer's page
// (about 32 kB compressed on /ask).
export const LEAD_LIMITS = {
  nameMaxLength: 120,
  emailMaxLength: 254,
  phoneMaxLength: 40,
  phoneMinDigits: 7,
  // A flood guard, not a business rule: more than this many leads from one e-mail or phone in an hour answers 429.
  perContactPerHour: 3,
  // Also a flood guard: leads from one client address in an hour (generous: a café or a carrier shares one).
  perAddressPerHour: 20,
  honeypotMaxLength: 500,
  pageSizeMax: 100,
} as const;
