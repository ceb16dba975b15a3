/** /api/notification-settings: the signed-in person's e-mail notices. */
import { Router } from 'express';
import { NotificationSettings, type NotificationSettingsResponse } from '../../contracts/notifications';
import { currentAuth } from '../../middleware/session';
import type { NotificationsService } from './notifications.service';

export function notificationSettingsRouter(notifications: NotificationsService): Router {
  const router = Router();

  router.get('/notification-settings', async (_req, res) => {
    const { user } = currentAuth(res);
    res.json({ settings: await notifications.get(user.id) } satisfies NotificationSettingsResponse);
  });

  router.put('/notification-settings', async (req, res) => {
    const { user } = currentAuth(res);
    const input = NotificationSettings.parse(req.body);
    res.json({ settings: await notifications.save(user.id, input) } satisfies NotificationSettingsResponse);
  });

  return router;
}
