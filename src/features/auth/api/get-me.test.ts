import { describe, expect, it } from 'vitest';
import { parseMe } from './get-me';

const user = { id: 'u1', email: 'rosa@kitlane.test', displayName: 'Rosa', roles: ['drummer'], emailVerified: false, timeZone: 'UTC' };

describe('parseMe', () => {
  it('accepts the signed-in user shape of GET /api/me', () => {
    expect(parseMe({ user })).toEqual({ user });
  });

  it('accepts a signed-out answer', () => {
    expect(parseMe({ user: null })).toEqual({ user: null });
  });

  it('rejects a user with a missing field rather than passing undefined on', () => {
    const { timeZone: _dropped, ...partial } = user;
    expect(() => parseMe({ user: partial })).toThrow(/unexpected answer/);
  });

  it('rejects an answer without a user key', () => {
    expect(() => parseMe({})).toThrow(/unexpected answer/);
  });
});
