// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { fakeServer, renderAt } from '@/testing/render-with-providers';
import { SignUpForm } from './sign-up-form';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function fill(label: string | RegExp, value: string) {
  fireEvent.change(screen.getByLabelText(label), { target: { value } });
}

function fillValidForm() {
  fill('Email', 'rosa@kitlane.test');
  fill('Password', 'brush-swell-ghost-notes');
  fill('Display name', 'Rim Shot Rosa');
  fireEvent.click(screen.getByRole('checkbox', { name: /Drummer/ }));
}

/** The message a field points at through aria-describedby: what a screen reader reads with it. */
function describedText(element: HTMLElement): string {
  return (element.getAttribute('aria-describedby') ?? '')
    .split(' ')
    .map((id) => document.getElementById(id)?.textContent ?? '')
    .join(' ');
}

describe('SignUpForm', () => {
  it('shows the shared schema’s messages beside each field without calling the server', async () => {
    const { calls } = fakeServer([]);
    renderAt(<SignUpForm />);
    fireEvent.click(screen.getByRole('button', { name: 'Create account' }));

    expect(await screen.findByText('Enter a valid email address')).toBeTruthy();
    expect(describedText(screen.getByLabelText('Password'))).toContain('Use at least 10 characters');
    expect(screen.getByLabelText('Password').getAttribute('aria-invalid')).toBe('true');
    expect(describedText(screen.getByLabelText('Display name'))).toContain('Use at least 2 characters');
    expect(screen.getByText('Pick at least one role')).toBeTruthy();
    expect(calls).toEqual([]);
  });

  it('rejects a common password on the client with the server’s own rule', async () => {
    fakeServer([]);
    renderAt(<SignUpForm />);
    fillValidForm();
    fill('Password', 'drummer1234');
    fireEvent.click(screen.getByRole('button', { name: 'Create account' }));
    expect(await screen.findByText(/too common/)).toBeTruthy();
  });

  it('puts the server’s field message beside the email when the address is taken', async () => {
    fakeServer([
      {
        method: 'POST',
        path: '/api/auth/signup',
        status: 409,
        body: { error: { code: 'email_taken', message: 'An account with this email already exists', fields: { email: 'Already has an account — sign in instead' } } },
      },
    ]);
    renderAt(<SignUpForm />);
    fillValidForm();
    fireEvent.click(screen.getByRole('button', { name: 'Create account' }));

    await waitFor(() => expect(describedText(screen.getByLabelText('Email'))).toContain('Already has an account — sign in instead'));
    // The field message is enough; no duplicate alert at the top.
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('sends the chosen roles and goes on to "check your inbox"', async () => {
    const user = { id: 'u1', email: 'rosa@kitlane.test', displayName: 'Rim Shot Rosa', roles: ['drummer', 'engineer'], emailVerified: false, timeZone: 'UTC' };
    const { calls } = fakeServer([{ method: 'POST', path: '/api/auth/signup', status: 201, body: { user } }]);
    const { router, queryClient } = renderAt(<SignUpForm />, {
      path: '/sign-up',
      otherRoutes: [{ path: '/sign-up/check-inbox', element: <p>inbox page</p> }],
    });
    fillValidForm();
    fireEvent.click(screen.getByRole('checkbox', { name: /Engineer/ }));
    fireEvent.click(screen.getByRole('button', { name: 'Create account' }));

    expect(await screen.findByText('inbox page')).toBeTruthy();
    expect(router.state.location.pathname).toBe('/sign-up/check-inbox');
    expect(calls[0]?.body).toEqual({ email: 'rosa@kitlane.test', password: 'brush-swell-ghost-notes', displayName: 'Rim Shot Rosa', roles: ['drummer', 'engineer'] });
    expect(queryClient.getQueryData(['me'])).toEqual({ user });
  });

  it('keeps the button busy while the request is pending', async () => {
    let release: (r: Response) => void = () => undefined;
    vi.stubGlobal('fetch', vi.fn(() => new Promise<Response>((resolve) => (release = resolve))));
    renderAt(<SignUpForm />);
    fillValidForm();
    fireEvent.click(screen.getByRole('button', { name: 'Create account' }));

    const busy = await screen.findByRole('button', { name: /Creating your account/ });
    expect(busy.hasAttribute('disabled')).toBe(true);
    expect(busy.getAttribute('aria-busy')).toBe('true');
    release(new Response(JSON.stringify({ error: { code: 'internal', message: 'Try again' } }), { status: 500 }));
    expect(await screen.findByRole('alert')).toBeTruthy();
  });
});
