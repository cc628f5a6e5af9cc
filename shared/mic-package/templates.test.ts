import { describe, expect, it } from 'vitest';
import { channelWarnings } from './guidance';
import { SOURCE_IDS } from './sources';
import { channelsFromTemplate, COMMON_DISTANCE_RANGES_CM, defaultChannel, getTemplate, listTemplates, TEMPLATE_IDS } from './templates';

describe('package templates', () => {
  it('offers 4, 8 and 12 channels numbered from 1', () => {
    const counts = TEMPLATE_IDS.map((id) => channelsFromTemplate(id).length);
    expect(counts).toEqual([4, 8, 12]);
    for (const id of TEMPLATE_IDS) {
      expect(channelsFromTemplate(id).map((c) => c.number)).toEqual(channelsFromTemplate(id).map((_, i) => i + 1));
    }
  });

  it('uses each source at most once per template', () => {
    for (const t of listTemplates()) {
      const sources = t.channels.map((c) => c.source);
      expect(new Set(sources).size).toBe(sources.length);
    }
  });

  it('hands out copies, so editing one package leaves the template alone', () => {
    const first = channelsFromTemplate('eight_channel');
    first[0].distanceCm = 999;
    expect(channelsFromTemplate('eight_channel')[0].distanceCm).not.toBe(999);
  });

  it('keeps every default distance within its common-practice range', () => {
    for (const t of listTemplates()) {
      for (const ch of t.channels) {
        const range = COMMON_DISTANCE_RANGES_CM[ch.source];
        expect(range, ch.source).toBeDefined();
        expect(ch.distanceCm).toBeGreaterThanOrEqual(range!.min);
        expect(ch.distanceCm).toBeLessThanOrEqual(range!.max);
      }
    }
  });

  it('raises no placement hint on its own defaults', () => {
    for (const ch of getTemplate('twelve_channel').channels) expect(channelWarnings(ch), ch.source).toEqual([]);
  });

  it('gives a default channel for every source', () => {
    for (const source of SOURCE_IDS) expect(defaultChannel(source, 3)).toMatchObject({ number: 3, source });
  });
});
