import { Router } from 'express';
import type { AppContext } from '../../app';
import { requireSignedIn, requireUser } from '../../auth/middleware';
import { notFound } from '../../http/app-error';
import { bodyOf, queryOf, validateBody, validateQuery } from '../../http/validate';
import {
  listNotificationsQuerySchema,
  markNotificationsReadInputSchema,
  notificationSettingsInputSchema,
  type NotificationSettings,
} from '@shared/schemas/notifications';

/** The bell (list, mark read) and the per-kind mail settings every notification mail links to. */
export function notificationsRoutes(ctx: AppContext): Router {
  const { notifications } = ctx;
  const r = Router();
  r.use('/notifications', requireSignedIn);

  r.get('/notifications', validateQuery(listNotificationsQuerySchema), (_req, res) => {
    const { limit } = queryOf(res, listNotificationsQuerySchema);
    res.json(notifications.list(requireUser(res).id, limit));
  });

  r.post('/notifications/read', validateBody(markNotificationsReadInputSchema), (_req, res) => {
    const user = requireUser(res);
    const { id } = bodyOf(res, markNotificationsReadInputSchema);
    // Someone else's notification is answered like one that does not exist.
    if (notifications.markRead(user.id, id) === 0 && id) throw notFound('That notification');
    res.json({ unread: notifications.unreadCount(user.id) });
  });

  r.get('/notifications/settings', (_req, res) => {
    const settings: NotificationSettings = { mutedKinds: notifications.mutedKinds(requireUser(res).id) };
    res.json(settings);
  });

  r.put('/notifications/settings', validateBody(notificationSettingsInputSchema), (_req, res) => {
    const user = requireUser(res);
    notifications.setMuted(user.id, bodyOf(res, notificationSettingsInputSchema).mutedKinds);
    const settings: NotificationSettings = { mutedKinds: notifications.mutedKinds(user.id) };
    res.json(settings);
  });

  return r;
}
