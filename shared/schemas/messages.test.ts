import { describe, expect, it } from 'vitest';
import { listMessagesQuerySchema, previewOf, sendMessageInputSchema } from './messages';

describe('previewOf', () => {
  it('folds whitespace into one line', () => {
    expect(previewOf('  Verse one:\n\n  half-time\tfeel ')).toBe('Verse one: half-time feel');
  });

  it('cuts long text at the limit with an ellipsis', () => {
    const cut = previewOf('word '.repeat(100), 20);
    expect(cut.length).toBeLessThanOrEqual(20);
    expect(cut.endsWith('…')).toBe(true);
  });
});

describe('listMessagesQuerySchema', () => {
  it('reads ?after as an ISO time or as epoch milliseconds, to the same instant', () => {
    const iso = listMessagesQuerySchema.parse({ after: '2031-03-04T05:06:07.089Z' }).after!;
    const ms = listMessagesQuerySchema.parse({ after: String(Date.UTC(2031, 2, 4, 5, 6, 7, 89)) }).after!;
    expect(iso.getTime()).toBe(ms.getTime());
  });

  it('refuses words and unknown parameters', () => {
    expect(listMessagesQuerySchema.safeParse({ after: 'yesterday' }).success).toBe(false);
    expect(listMessagesQuerySchema.safeParse({ before: '1' }).success).toBe(false);
  });
});

describe('sendMessageInputSchema', () => {
  it('trims the body and refuses an empty one', () => {
    expect(sendMessageInputSchema.parse({ body: '  hi  ' }).body).toBe('hi');
    expect(sendMessageInputSchema.safeParse({ body: '   ' }).success).toBe(false);
  });
});
