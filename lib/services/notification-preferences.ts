/** A person's notification settings: one mode per kind, defaults where they chose nothing. */
import { randomUUID } from 'node:crypto';
import { NotificationPreference } from '@/entities';
import type { Em } from '@/lib/db/orm';
import {
  defaultModes,
  kindDescriptions,
  notificationKinds,
  preferencesFromRows,
  resolvePreferences,
  type DeliveryMode,
  type NotificationKind,
  type StoredPreferences,
} from '@/lib/notifications';

export interface NotificationPreferenceDto {
  kind: NotificationKind;
  label: string;
  hint: string;
  mode: DeliveryMode;
  defaultMode: DeliveryMode;
  /** Whether the person chose it (false: the default applies). */
  chosen: boolean;
}

export interface NotificationPreferencesDto {
  items: NotificationPreferenceDto[];
}

export async function storedPreferences(em: Em, userIds: readonly string[]): Promise<Map<string, StoredPreferences>> {
  const out = new Map<string, StoredPreferences>();
  if (!userIds.length) return out;
  const rows = await em.find(NotificationPreference, { user: { $in: [...userIds] } });
  const byUser = new Map<string, { kind: string; mode: string }[]>();
  for (const r of rows) {
    const list = byUser.get(r.user.id) ?? [];
    list.push({ kind: r.kind, mode: r.mode });
    byUser.set(r.user.id, list);
  }
  for (const [id, list] of byUser) out.set(id, preferencesFromRows(list));
  return out;
}

export async function getNotificationPreferences(em: Em, userId: string): Promise<NotificationPreferencesDto> {
  const stored = (await storedPreferences(em, [userId])).get(userId) ?? {};
  const modes = resolvePreferences(stored);
  return {
    items: notificationKinds.map((kind) => ({
      kind,
      ...kindDescriptions[kind],
      mode: modes[kind],
      defaultMode: defaultModes[kind],
      chosen: stored[kind] !== undefined,
    })),
  };
}

/** Sets the given kinds (others keep their setting); an upsert, so two saves at once never collide. */
export async function updateNotificationPreferences(
  em: Em,
  userId: string,
  change: Partial<Record<NotificationKind, DeliveryMode>>,
): Promise<NotificationPreferencesDto> {
  const entries = Object.entries(change).filter((e): e is [NotificationKind, DeliveryMode] => e[1] !== undefined);
  if (entries.length) {
    await em.transactional(async (tx) => {
      for (const [kind, mode] of entries) {
        await tx.execute(
          `insert into notification_preference (id, user_id, kind, mode, updated_at) values (?, ?, ?, ?, now())
           on conflict (user_id, kind) do update set mode = excluded.mode, updated_at = now()`,
          [randomUUID(), userId, kind, mode],
        );
      }
    });
  }
  return getNotificationPreferences(em, userId);
}
