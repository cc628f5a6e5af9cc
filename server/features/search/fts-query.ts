// People type words, not FTS5 syntax. A query is cut into runs of letters and digits (the same idea of a
// word as the unicode61 tokenizer's), and each becomes a quoted prefix term, so quotes, `*`, `-`, `:`,
// `NEAR(`, `AND`/`OR`/`NOT` are only ever words or separators — never operators, never an error.

const WORD = /[\p{L}\p{M}\p{N}]+/gu;
export const MAX_QUERY_TERMS = 12;
const MAX_TERM_LENGTH = 40;

export function queryTerms(q: string | undefined): string[] {
  if (!q) return [];
  const terms = (q.match(WORD) ?? []).map((t) => t.toLowerCase().slice(0, MAX_TERM_LENGTH));
  return [...new Set(terms)].slice(0, MAX_QUERY_TERMS);
}

/**
 * An FTS5 MATCH expression where every term must appear (implicit AND), each (but one-letter terms) as a
 * prefix so "drum" finds "drummer" and "funk" finds "funky"; null when nothing searchable is left.
 */
export function toFtsMatch(q: string | undefined): string | null {
  const terms = queryTerms(q);
  if (terms.length === 0) return null;
  // Terms hold only letters, marks and digits, so they never contain a double quote to escape.
  // A one-letter prefix would expand to a large share of the vocabulary ("r"* of "r&b"): match it exactly.
  return terms.map((t) => (t.length > 1 ? `"${t}"*` : `"${t}"`)).join(' ');
}
