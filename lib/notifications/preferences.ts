import { defaultModes, isDeliveryMode, isNotificationKind, notificationKinds, type DeliveryMode, type NotificationKind } from './kinds';

/** A person's stored choices; kinds they never chose are absent. */
export type StoredPreferences = Partial<Record<NotificationKind, DeliveryMode>>;
export type Preferences = Record<NotificationKind, DeliveryMode>;

/** The mode for one kind: the person's choice, else the default. */
export function resolveMode(stored: StoredPreferences | undefined, kind: NotificationKind): DeliveryMode {
  const chosen = stored?.[kind];
  return chosen && isDeliveryMode(chosen) ? chosen : defaultModes[kind];
}

const EAGERNESS: Record<DeliveryMode, number> = { immediate: 2, digest: 1, off: 0 };

/** The mode for a mail that belongs to two kinds: the more eager of the person's two choices. */
export function resolveModeFor(stored: StoredPreferences | undefined, kind: NotificationKind, alsoKind?: NotificationKind): DeliveryMode {
  const a = resolveMode(stored, kind);
  if (!alsoKind) return a;
  const b = resolveMode(stored, alsoKind);
  return EAGERNESS[b] > EAGERNESS[a] ? b : a;
}

/** Every kind with its effective mode. */
export function resolvePreferences(stored: StoredPreferences | undefined): Preferences {
  return Object.fromEntries(notificationKinds.map((k) => [k, resolveMode(stored, k)])) as Preferences;
}

/** Stored rows (kind, mode) to a map; rows with unknown kinds or modes (older versions) are ignored. */
export function preferencesFromRows(rows: readonly { kind: string; mode: string }[]): StoredPreferences {
  const out: StoredPreferences = {};
  for (const r of rows) if (isNotificationKind(r.kind) && isDeliveryMode(r.mode)) out[r.kind] = r.mode;
  return out;
}
