'use server';

import { revalidatePath } from 'next/cache';
import { action } from '@/lib/http/action';
import { updateNotificationPreferences as save, type NotificationPreferencesDto } from '@/lib/services/notification-preferences';
import { notificationPreferencesSchema } from './notification-schema';

/** Saves the notification form; `data` holds every kind with its mode as now stored. */
export const updateNotificationPreferences = action<typeof notificationPreferencesSchema, NotificationPreferencesDto>(
  notificationPreferencesSchema,
  async (input, { em, user }) => {
    const data = await save(em, user.id, input);
    revalidatePath('/account');
    return { message: 'Notification settings saved.', data };
  },
);
