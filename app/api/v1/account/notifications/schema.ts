import { z } from 'zod';
import { deliveryModes, notificationKinds } from '@/lib/notifications/kinds';

/**
 * Any subset of the kinds, each set to a mode, e.g. `{"mention": "off", "thread": "immediate"}`.
 * An unknown kind or mode is a 400 that names it.
 */
export const notificationPreferencesBody = z.partialRecord(z.enum(notificationKinds), z.enum(deliveryModes));
export type NotificationPreferencesBody = z.infer<typeof notificationPreferencesBody>;
