import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { ApiError } from '../api/client.js';
import { SignInForm } from './SignInForm.js';

describe('SignInForm', () => {
  it('names the missing fields and does not submit', async () => {
    const onSignIn = vi.fn();
    render(<SignInForm onSignIn={onSignIn} />);
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Enter your email address')).toBeInTheDocument();
    expect(screen.getByText('Enter your password')).toBeInTheDocument();
    expect(onSignIn).not.toHaveBeenCalled();
  });

  it('submits the typed values', async () => {
    const onSignIn = vi.fn(async () => undefined);
    render(<SignInForm onSignIn={onSignIn} />);
    await userEvent.type(screen.getByLabelText('Email'), 'engineer@fenwick.example');
    await userEvent.type(screen.getByLabelText('Password'), 'tailpair-demo');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(onSignIn).toHaveBeenCalledWith({ email: 'engineer@fenwick.example', password: 'tailpair-demo' });
  });

  it('shows a plain message when the server refuses the password', async () => {
    const onSignIn = vi.fn(async () => Promise.reject(new ApiError(401, 'Invalid credentials')));
    render(<SignInForm onSignIn={onSignIn} />);
    await userEvent.type(screen.getByLabelText('Email'), 'viewer@fenwick.example');
    await userEvent.type(screen.getByLabelText('Password'), 'wrong');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByRole('alert')).toHaveTextContent(
      'That email and password do not match an account.',
    );
  });
});
