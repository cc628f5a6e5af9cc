import { describe, expect, it } from 'vitest';
import type { MessageView } from '@shared/schemas/messages';
import { mergeMessages } from './get-thread-messages';

const msg = (id: string, createdAt: string, body = id): MessageView => ({ id, threadId: 't', senderId: 's', senderName: 'S', body, attachment: null, createdAt });

describe('mergeMessages', () => {
  it('appends polled messages after the held ones, oldest first', () => {
    const merged = mergeMessages([msg('a', '2031-01-01T10:00:00.000Z')], [msg('c', '2031-01-01T10:00:02.000Z'), msg('b', '2031-01-01T10:00:01.000Z')]);
    expect(merged.map((m) => m.id)).toEqual(['a', 'b', 'c']);
  });

  it('keeps a message once when the poll and the send both deliver it', () => {
    const sent = msg('b', '2031-01-01T10:00:01.000Z');
    const merged = mergeMessages([msg('a', '2031-01-01T10:00:00.000Z'), sent], [sent]);
    expect(merged.map((m) => m.id)).toEqual(['a', 'b']);
  });

  it('returns the same array when nothing is new, so React sees no change', () => {
    const held = [msg('a', '2031-01-01T10:00:00.000Z')];
    expect(mergeMessages(held, [])).toBe(held);
  });
});
