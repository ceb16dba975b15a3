/**
 * A person's e-mail notices (opt-in; all off until turned on).
 *   GET /api/notification-settings                                -> NotificationSettingsResponse
 *   PUT /api/notification-settings  NotificationSettings          -> NotificationSettingsResponse
 * `analysisFinished`: an e-mail when an analysis you started finishes (done or failed).
 */
import { z } from 'zod';

export const NotificationSettings = z.object({ analysisFinished: z.boolean() });
export type NotificationSettings = z.infer<typeof NotificationSettings>;

export const NotificationSettingsResponse = z.object({ settings: NotificationSettings });
export type NotificationSettingsResponse = z.infer<typeof NotificationSettingsResponse>;
