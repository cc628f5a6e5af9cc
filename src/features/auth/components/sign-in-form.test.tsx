// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, screen } from '@testing-library/react';
import { fakeServer, renderAt } from '@/testing/render-with-providers';
import { GENERIC_SIGN_IN_ERROR, SignInForm } from './sign-in-form';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function submit(email: string, password: string) {
  fireEvent.change(screen.getByLabelText('Email'), { target: { value: email } });
  fireEvent.change(screen.getByLabelText('Password'), { target: { value: password } });
  fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
}

describe('SignInForm', () => {
  it('shows one generic message for wrong credentials, not the server’s wording', async () => {
    fakeServer([{ method: 'POST', path: '/api/auth/login', status: 401, body: { error: { code: 'invalid_credentials', message: 'Email or password is not right' } } }]);
    renderAt(<SignInForm next={null} />);
    submit('nobody@kitlane.test', 'whatever-password');
    expect((await screen.findByRole('alert')).textContent).toBe(GENERIC_SIGN_IN_ERROR);
  });

  it('says how long to wait after too many attempts, from Retry-After, and blocks the button', async () => {
    fakeServer([
      { method: 'POST', path: '/api/auth/login', status: 429, body: { error: { code: 'rate_limited', message: 'Too many' } }, headers: { 'Retry-After': '37' } },
    ]);
    renderAt(<SignInForm next={null} />);
    submit('rosa@kitlane.test', 'whatever-password');
    expect((await screen.findByRole('alert')).textContent).toMatch(/Too many attempts, try again in 3[67] s/);
    expect(screen.getByRole('button', { name: 'Sign in' }).hasAttribute('disabled')).toBe(true);
  });

  it('goes to the return address after signing in, but never off-site', async () => {
    const user = { id: 'u1', email: 'rosa@kitlane.test', displayName: 'Rosa', roles: ['drummer'], emailVerified: true, timeZone: 'UTC' };
    fakeServer([{ method: 'POST', path: '/api/auth/login', status: 200, body: { user } }]);
    const { router } = renderAt(<SignInForm next="//elsewhere.example/steal" />, {
      path: '/sign-in',
      otherRoutes: [{ path: '/', element: <p>home page</p> }],
    });
    submit('rosa@kitlane.test', 'brush-swell-ghost-notes');
    expect(await screen.findByText('home page')).toBeTruthy();
    expect(router.state.location.pathname).toBe('/');
  });
});
