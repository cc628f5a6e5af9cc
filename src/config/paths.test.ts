import { describe, expect, it } from 'vitest';
import { paths, safeNext } from './paths';

describe('safeNext', () => {
  it('keeps a path inside the app', () => {
    expect(safeNext('/account?tab=password')).toBe('/account?tab=password');
  });

  it.each(['https://elsewhere.example/', '//elsewhere.example/', '/\\elsewhere.example', 'account', '', null, undefined])(
    'refuses %s as a return address',
    (next) => {
      expect(safeNext(next)).toBeNull();
    },
  );
});

describe('paths', () => {
  it('puts the return address on the sign-in link, encoded', () => {
    expect(paths.signIn.getHref('/account?x=1')).toBe('/sign-in?next=%2Faccount%3Fx%3D1');
  });

  it('drops an off-site return address from the sign-in link', () => {
    expect(paths.signIn.getHref('//elsewhere.example')).toBe('/sign-in');
  });

  it('encodes mailed tokens in verification and reset links', () => {
    expect(paths.verifyEmail.getHref('a+b/c')).toBe('/verify-email?token=a%2Bb%2Fc');
    expect(paths.resetPassword.getHref('t=1')).toBe('/reset-password?token=t%3D1');
  });

  it('has one distinct path per page', () => {
    const all = Object.values(paths).map((p) => p.path);
    expect(new Set(all).size).toBe(all.length);
  });
});
