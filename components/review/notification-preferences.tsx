'use client';

import { ActionMessage } from '@/components/ui/action-message';
import type { FormAction } from '@/components/ui/action-types';
import { Panel } from '@/components/ui/panel';
import { SubmitButton } from '@/components/ui/submit-button';
import { useFormAction } from '@/components/ui/use-form-action';
import { modeLabels } from '@/lib/notifications/kinds';
import type { NotificationPreferencesDto } from '@/lib/services/notification-preferences';

const MODES = [
  { value: 'immediate', label: modeLabels.immediate, help: 'an e-mail for each event' },
  { value: 'digest', label: modeLabels.digest, help: 'one e-mail a day listing them' },
  { value: 'off', label: modeLabels.off, help: 'no e-mail' },
] as const;

/**
 * Per event kind: an e-mail at once, in the daily digest, or none. Mount on the account page
 * with the server's current settings and the `updateNotificationPreferences` action.
 */
export function NotificationPreferences({ initial, action }: { initial: NotificationPreferencesDto; action: FormAction<NotificationPreferencesDto> }) {
  const { state, formAction, onSubmit, pending } = useFormAction(action);
  const items = (state.ok && state.data ? state.data : initial).items;
  return (
    <Panel title="E-mail notifications" description="For each kind of event, when you hear about it. The digest goes out once a day." data-testid="notification-preferences">
      <form action={formAction} onSubmit={onSubmit} className="flex flex-col gap-4">
        <table className="w-full text-sm">
          <caption className="sr-only">Notification settings per event</caption>
          <thead className="text-left text-2xs uppercase tracking-wide text-paper-600">
            <tr>
              <th scope="col" className="py-1 pr-3">Event</th>
              {MODES.map((m) => (
                <th key={m.value} scope="col" className="px-2 py-1 text-center">
                  {m.label}
                </th>
              ))}
            </tr>
          </thead>
          <tbody className="divide-y divide-paper-200">
            {items.map((it) => (
              <tr key={`${it.kind}-${it.mode}`} data-testid={`notify-${it.kind}`}>
                <th scope="row" className="py-2 pr-3 text-left font-normal">
                  <span className="font-medium text-paper-900">{it.label}</span>
                  <span className="block text-xs text-paper-600">
                    {it.hint} {!it.chosen && <span>(default: {MODES.find((m) => m.value === it.defaultMode)?.label.toLowerCase()})</span>}
                  </span>
                </th>
                {MODES.map((m) => (
                  <td key={m.value} className="px-2 py-2 text-center">
                    <input
                      type="radio"
                      name={it.kind}
                      value={m.value}
                      defaultChecked={it.mode === m.value}
                      aria-label={`${it.label}: ${m.label}, ${m.help}`}
                      className="h-4 w-4 accent-ink-800"
                      data-testid={`notify-${it.kind}-${m.value}`}
                    />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        <ActionMessage state={state} testId="notification-message" />
        <div>
          <SubmitButton pending={pending} pendingLabel="Saving…" data-testid="notification-save">
            Save notification settings
          </SubmitButton>
        </div>
      </form>
    </Panel>
  );
}
