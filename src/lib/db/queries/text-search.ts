import 'server-only';
// How a staff search box becomes an indexed condition. A LIKE '%q%' cannot use an index, so searches
// go to the FULLTEXT indexes (database/migrations/20261204000100-list-and-report-indexes.js), word
// prefixes only; words shorter than InnoDB's smallest indexed token fall back to a prefix LIKE on
// B-tree columns.

/** innodb_ft_min_token_size (the server default): shorter words are not in a FULLTEXT index. */
export const FULLTEXT_MIN_WORD = 3;

export type TextSearch =
  | { kind: 'fulltext'; against: string }
  | { kind: 'prefix'; like: string }
  /** Nothing searchable in q (only punctuation, say): no row can match. */
  | { kind: 'nothing' };

/** Escapes LIKE wildcards and anchors the term at the start: "50%" finds "50%…", uses the index. */
export function prefixLike(q: string): string {
  return `${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/**
 * Every word must start a word of the row ("kow ann" finds "Anna Kowalski"). Words are cut on what the
 * full-text parser cuts on, so no operator character of boolean mode can reach the AGAINST string.
 */
export function textSearch(q: string): TextSearch {
  const words = q.split(/[^\p{L}\p{N}_]+/u).filter(Boolean);
  if (!words.length) return { kind: 'nothing' };
  const long = words.filter((w) => w.length >= FULLTEXT_MIN_WORD);
  if (long.length) return { kind: 'fulltext', against: long.map((w) => `+${w}*`).join(' ') };
  return { kind: 'prefix', like: prefixLike(q.trim()) };
}
