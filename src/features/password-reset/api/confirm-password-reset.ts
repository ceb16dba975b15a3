/** POST /api/password-resets/confirm {token, password} → 204; the account's other sessions end. */
import { useMutation } from '@tanstack/react-query';
import type { PasswordResetConfirmRequest } from '../../../../server/contracts/password-resets';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';

export function confirmPasswordReset(body: PasswordResetConfirmRequest): Promise<void> {
  return api.post<void>(apiPaths.passwordResets.confirm(), body);
}

export function useConfirmPasswordReset() {
  return useMutation({ mutationFn: confirmPasswordReset });
}
