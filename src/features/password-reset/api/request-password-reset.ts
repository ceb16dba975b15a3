/** POST /api/password-resets {email} → 202; the same answer whether or not the address has an account. */
import { useMutation } from '@tanstack/react-query';
import type { PasswordResetRequest, PasswordResetRequestedResponse } from '../../../../server/contracts/password-resets';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';

export function requestPasswordReset(body: PasswordResetRequest): Promise<PasswordResetRequestedResponse> {
  return api.post<PasswordResetRequestedResponse>(apiPaths.passwordResets.request(), body);
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
