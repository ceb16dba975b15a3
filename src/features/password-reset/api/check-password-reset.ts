/** POST /api/password-resets/check {token} → the account's address (404 unknown, 410 used or expired). */
import { useQuery } from '@tanstack/react-query';
import type { PasswordResetCheckResponse } from '../../../../server/contracts/password-resets';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';

export const passwordResetKeys = {
  all: ['password-reset'] as const,
  check: (token: string) => [...passwordResetKeys.all, 'check', token] as const,
};

export function checkPasswordReset(token: string, signal?: AbortSignal): Promise<PasswordResetCheckResponse> {
  return api.post<PasswordResetCheckResponse>(apiPaths.passwordResets.check(), { token }, { signal });
}

export function usePasswordResetCheck(token: string) {
  return useQuery({ queryKey: passwordResetKeys.check(token), queryFn: ({ signal }) => checkPasswordReset(token, signal), retry: false });
}
