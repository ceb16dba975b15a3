/** GET /api/notification-settings → the signed-in person's e-mail notices. */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { NotificationSettingsResponse } from '../../../../server/contracts/notifications';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { notificationKeys } from './keys';

export function getNotificationSettings(signal?: AbortSignal): Promise<NotificationSettingsResponse> {
  return api.get<NotificationSettingsResponse>(apiPaths.notificationSettings(), { signal });
}

export const notificationSettingsQueryOptions = () =>
  queryOptions({ queryKey: notificationKeys.settings(), queryFn: ({ signal }) => getNotificationSettings(signal) });

export function useNotificationSettings() {
  return useSuspenseQuery(notificationSettingsQueryOptions()).data.settings;
}
