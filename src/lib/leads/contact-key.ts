// The flood guard counts people, not spellings: "Ana+ask1@Example.com" and "ana@example.com" are one
// inbox, "(555) 010-7" and "5550107" one phone. Pure, so the spellings are unit tested.

/** Lower case, without a +tag in the local part. */
export function normaliseEmail(email: string): string {
  const trimmed = email.trim().toLowerCase();
  const at = trimmed.lastIndexOf('@');
  if (at < 1) return trimmed;
  const local = trimmed.slice(0, at).split('+')[0];
  return `${local || trimmed.slice(0, at)}@${trimmed.slice(at + 1)}`;
}

/** Digits only; a leading 1 on an 11-digit number (the North American trunk prefix) is dropped. */
export function normalisePhone(phone: string): string {
  const digits = phone.replace(/\D/g, '');
  return digits.length === 11 && digits.startsWith('1') ? digits.slice(1) : digits;
}

export function contactKeys(contact: { email?: string; phone?: string }): string[] {
  const keys: string[] = [];
  if (contact.email) keys.push(`email:${normaliseEmail(contact.email)}`);
  if (contact.phone) keys.push(`phone:${normalisePhone(contact.phone)}`);
  return keys;
}
