// Reading the frozen advisor result of a sent quote (pure): only the plain-words texts are shown.

/** The plain-words reasons and cautions of a frozen advice, for pages and documents. */
export function adviceWords(advice: unknown): { reasons: string[]; cautions: string[] } {
  const texts = (list: unknown) =>
    Array.isArray(list)
      ? list
          .map((x) =>
            x && typeof x === 'object' && typeof (x as { text?: unknown }).text === 'string'
              ? (x as { text: string }).text
              : null,
          )
          .filter((x): x is string => Boolean(x))
      : [];
  const a = (advice ?? {}) as { reasons?: unknown; cautions?: unknown };
  return { reasons: texts(a.reasons), cautions: texts(a.cautions) };
}
