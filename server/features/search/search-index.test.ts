import { describe, expect, it } from 'vitest';
import { openDb } from '../../db/client';
import { applyMigrations } from '../../db/migrate';
import { DRUM_STYLES } from '@shared/schemas/profiles';
import { styleBit } from './search.repository';

function freshDb() {
  const db = openDb(':memory:');
  applyMigrations(db);
  return db.$client;
}

describe('the drummer search index (drizzle/0003 triggers)', () => {
  it('has the same style bits as DRUM_STYLES', () => {
    const sqlite = freshDb();
    const rows = sqlite.prepare('SELECT style, bit FROM drummer_style_bits ORDER BY bit').all() as { style: string; bit: number }[];
    expect(rows.map((r) => r.style)).toEqual([...DRUM_STYLES]);
    for (const r of rows) expect(styleBit(r.style)).toBe(2 ** r.bit);
  });

  it('indexes a drummer only while listed: published, with a headline, enabled, still a drummer', () => {
    const sqlite = freshDb();
    sqlite.prepare(`INSERT INTO users (id, email, display_name, password_hash, roles, created_at) VALUES ('u1', 'a@x', 'Ona Vell', 'x', '["drummer"]', 0)`).run();
    const listed = () => (sqlite.prepare(`SELECT count(*) AS n FROM drummer_search_rows WHERE user_id = 'u1'`).get() as { n: number }).n;
    const fts = (q: string) => (sqlite.prepare('SELECT count(*) AS n FROM drummer_fts WHERE drummer_fts MATCH ?').get(q) as { n: number }).n;
    sqlite.prepare(`INSERT INTO drummer_profiles (user_id, headline, styles, published, updated_at) VALUES ('u1', 'Brush work', '["jazz","funk"]', 0, 0)`).run();
    expect(listed()).toBe(0);
    sqlite.prepare(`UPDATE drummer_profiles SET published = 1 WHERE user_id = 'u1'`).run();
    expect(listed()).toBe(1);
    expect(fts('"brush"*')).toBe(1);
    expect((sqlite.prepare(`SELECT style_mask AS m FROM drummer_search_rows`).get() as { m: number }).m).toBe(styleBit('jazz') + styleBit('funk'));

    sqlite.prepare(`UPDATE users SET display_name = 'Ona Trask' WHERE id = 'u1'`).run();
    expect(fts('"trask"')).toBe(1);
    expect(fts('"vell"')).toBe(0);

    sqlite.prepare(`UPDATE users SET disabled_at = 1 WHERE id = 'u1'`).run();
    expect(listed()).toBe(0);
    expect(fts('"brush"*')).toBe(0);
    sqlite.prepare(`UPDATE users SET disabled_at = NULL, roles = '["songwriter"]' WHERE id = 'u1'`).run();
    expect(listed()).toBe(0);
    sqlite.prepare(`UPDATE users SET roles = '["drummer"]' WHERE id = 'u1'`).run();
    expect(listed()).toBe(1);
    sqlite.prepare(`UPDATE drummer_profiles SET headline = '' WHERE user_id = 'u1'`).run();
    expect(listed()).toBe(0);
    sqlite.prepare(`UPDATE drummer_profiles SET headline = 'Back again' WHERE user_id = 'u1'`).run();
    sqlite.prepare(`DELETE FROM users WHERE id = 'u1'`).run();
    expect(listed()).toBe(0);
    expect(fts('"back"')).toBe(0);
  });
});
