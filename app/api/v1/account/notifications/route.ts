import { route } from '@/lib/http/route';
import {
  getNotificationPreferences,
  updateNotificationPreferences,
  type NotificationPreferencesDto,
} from '@/lib/services/notification-preferences';
import { notificationPreferencesBody } from './schema';

export const dynamic = 'force-dynamic';

export type NotificationPreferencesResponse = NotificationPreferencesDto;

/** The caller's notification settings: every kind with its mode and default. Signed-in sessions only. */
export const GET = route({ auth: 'session' }, async ({ em, caller }): Promise<NotificationPreferencesResponse> =>
  getNotificationPreferences(em, caller.userId),
);

/** Sets the given kinds; the others keep their setting. Answers with the full settings. */
export const PUT = route({ auth: 'session', body: notificationPreferencesBody }, async ({ em, caller, body }): Promise<NotificationPreferencesResponse> =>
  updateNotificationPreferences(em, caller.userId, body),
);
