import { useMutation } from '@tanstack/react-query';
import type { EmailSignInInput, EmailSignInResponse } from '@shared/schemas/me';
import { api } from '../../../lib/api-client';

/** Asks for a one-time sign-in link; the answer is the same whether or not the address has an account. */
export function useEmailSignIn() {
  return useMutation({
    mutationFn: (input: EmailSignInInput) => api<EmailSignInResponse>('/auth/email', { method: 'POST', body: input }),
  });
}
