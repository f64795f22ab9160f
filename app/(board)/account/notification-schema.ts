import { z } from 'zod';
import { deliveryModes, notificationKinds } from '@/lib/notifications/kinds';

/**
 * The account page's notification form: one field per kind, named by the kind
 * (`reviewer-assigned`, `new-revision`, `thread`, `mention`, `decision`, `outcome`), each
 * `immediate`, `digest` or `off`. Fields left out keep their setting.
 */
export const notificationPreferencesSchema = z.partialRecord(z.enum(notificationKinds), z.enum(deliveryModes));
export type NotificationPreferencesInput = z.infer<typeof notificationPreferencesSchema>;
