import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { ForgotPasswordRoute } from '@/routes/forgot-password';
import { SignInRoute } from '@/routes/sign-in';
import { answerFetch, errorAnswer, renderWithClient } from './support/render';

describe('account forms (one shell: fields, the server’s message, one submit button)', () => {
  it('when sign-in is refused without naming a field, then the message stands above the button', async () => {
    const calls = answerFetch(errorAnswer(401, 'wrong_credentials', 'That e-mail and password do not match.', []));
    renderWithClient(<SignInRoute />);
    await userEvent.type(screen.getByLabelText('E-mail'), 'ada@example.invalid');
    await userEvent.type(screen.getByLabelText('Password'), 'not-the-one-1');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect((await screen.findByRole('alert')).textContent).toContain('That e-mail and password do not match.');
    expect(calls[0]).toMatchObject({ url: '/api/session', method: 'POST' });
  });

  it('when a field is empty, then the form says so beside it and asks nothing of the server', async () => {
    renderWithClient(<SignInRoute />);
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    await waitFor(() => expect(screen.getByLabelText('E-mail').getAttribute('aria-invalid')).toBe('true'));
    expect(fetch).not.toHaveBeenCalled();
  });

  it('when a reset link is asked for, then the form gives way to the same answer whatever the address', async () => {
    answerFetch({ message: 'accepted' });
    renderWithClient(<ForgotPasswordRoute />);
    await userEvent.type(screen.getByLabelText('E-mail'), 'someone@example.invalid');
    await userEvent.click(screen.getByRole('button', { name: 'Send me a link' }));
    expect(await screen.findByText(/If that address belongs to a Halflight account/)).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Send me a link' })).toBeNull();
    expect(screen.getByRole('link', { name: 'Back to sign in' }).getAttribute('href')).toBe('/sign-in');
  });
});
