/** PUT /api/notification-settings → the saved settings. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { NotificationSettings, NotificationSettingsResponse } from '../../../../server/contracts/notifications';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { notificationKeys } from './keys';

export function saveNotificationSettings(body: NotificationSettings): Promise<NotificationSettingsResponse> {
  return apiRequest<NotificationSettingsResponse>('PUT', apiPaths.notificationSettings(), body);
}

export function useSaveNotificationSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveNotificationSettings,
    onSuccess: (data) => queryClient.setQueryData(notificationKeys.settings(), data),
  });
}
