import { describe, expect, it } from 'vitest';
import Database from 'better-sqlite3';
import { MAX_QUERY_TERMS, queryTerms, toFtsMatch } from './fts-query';

describe('turning a typed query into a safe FTS5 expression', () => {
  it('quotes each word as a prefix term', () => {
    expect(toFtsMatch('funk Drummer')).toBe('"funk"* "drummer"*');
  });

  it('treats FTS syntax and quotes as plain words', () => {
    expect(toFtsMatch('"rock" AND NEAR(jazz, 3) -metal kit:snare*')).toBe('"rock"* "and"* "near"* "jazz"* "3" "metal"* "kit"* "snare"*');
  });

  it('returns null when only punctuation is left', () => {
    expect(toFtsMatch('"*" - : ( )')).toBeNull();
    expect(toFtsMatch('   ')).toBeNull();
    expect(toFtsMatch(undefined)).toBeNull();
  });

  it('keeps letters with diacritics and other scripts together', () => {
    expect(queryTerms('Café brûlé ドラム')).toEqual(['café', 'brûlé', 'ドラム']);
  });

  it('drops repeats and caps the number of terms', () => {
    expect(queryTerms('a a a b')).toEqual(['a', 'b']);
    const many = Array.from({ length: 30 }, (_, i) => `w${i}`).join(' ');
    expect(queryTerms(many)).toHaveLength(MAX_QUERY_TERMS);
  });

  it('never makes SQLite FTS5 raise an error, whatever the input', () => {
    const db = new Database(':memory:');
    db.exec("CREATE VIRTUAL TABLE t USING fts5(body, tokenize = 'unicode61 remove_diacritics 2'); INSERT INTO t VALUES ('tight funky drummer with brushes');");
    const nasty = ['"', '""', '*', 'AND', 'OR NOT', 'NEAR(', 'body:funk', '-funk', '^funk', '(funk', 'funk)', "fu'nk", '{body}: x', 'funk + drummer', '\u0000', 'NOT'];
    const stmt = db.prepare('SELECT count(*) AS n FROM t WHERE t MATCH ?');
    for (const q of nasty) {
      const match = toFtsMatch(q);
      if (match) expect(() => stmt.get(match)).not.toThrow();
    }
    expect((stmt.get(toFtsMatch('funk drum')!) as { n: number }).n).toBe(1);
    expect((stmt.get(toFtsMatch('"funk" -drummer')!) as { n: number }).n).toBe(1);
    db.close();
  });
});
