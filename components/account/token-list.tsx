'use client';

import { useActionState, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Badge } from '@/components/ui/badge';
import { SubmitButton } from '@/components/ui/submit-button';
import { EmptyState } from '@/components/ui/empty-state';
import { formatDay } from '@/components/ui/format';
import { idle, type FormAction } from '@/components/ui/action-types';
import { useRefreshOnOk } from '@/components/members/use-refresh-on-ok';
import type { TokenRow } from './types';

export function TokenList({ tokens, revoke }: { tokens: TokenRow[]; revoke: FormAction }) {
  if (tokens.length === 0) {
    return (
      <EmptyState title="No API tokens" data-testid="no-tokens">
        Scripts on a cluster can create spectra and upload revisions with a token.
      </EmptyState>
    );
  }
  return (
    <table className="w-full text-left text-sm" data-testid="token-list">
      <caption className="sr-only">Your API tokens</caption>
      <thead className="bg-paper-100 text-2xs uppercase tracking-wide text-paper-700">
        <tr>
          <th scope="col" className="px-4 py-2">Name</th>
          <th scope="col" className="px-4 py-2">Starts with</th>
          <th scope="col" className="px-4 py-2">Group</th>
          <th scope="col" className="px-4 py-2">Created</th>
          <th scope="col" className="px-4 py-2">Last used</th>
          <th scope="col" className="px-4 py-2"><span className="sr-only">Revoke</span></th>
        </tr>
      </thead>
      <tbody>
        {tokens.map((t) => (
          <tr key={t.id} className="border-b border-paper-200 last:border-b-0" data-testid={`token-${t.name}`}>
            <td className="px-4 py-2 font-medium">{t.name}</td>
            <td className="px-4 py-2">
              <code className="text-xs text-paper-700">{t.prefix}…</code>
            </td>
            <td className="px-4 py-2 text-paper-700">{t.groupName}</td>
            <td className="tabular px-4 py-2 text-paper-700">{formatDay(t.createdAt)}</td>
            <td className="tabular px-4 py-2 text-paper-700">{t.lastUsedAt ? formatDay(t.lastUsedAt) : 'never'}</td>
            <td className="px-4 py-2 text-right">
              {t.revokedAt ? (
                <Badge tone="neutral" shape="cross" title={`Revoked ${formatDay(t.revokedAt)}`}>
                  revoked
                </Badge>
              ) : (
                <RevokeToken token={t} revoke={revoke} />
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function RevokeToken({ token, revoke }: { token: TokenRow; revoke: FormAction }) {
  const [confirming, setConfirming] = useState(false);
  const [state, formAction] = useActionState(revoke, idle);
  useRefreshOnOk(state);
  if (!confirming) {
    return (
      <Button variant="danger" size="sm" onClick={() => setConfirming(true)} aria-label={`Revoke token ${token.name}`} data-testid="revoke-token">
        Revoke
      </Button>
    );
  }
  return (
    <form action={formAction} className="inline-flex flex-wrap items-center justify-end gap-1.5">
      <input type="hidden" name="id" value={token.id} />
      <span className="text-xs">Scripts using it stop working.</span>
      <SubmitButton variant="danger" size="sm" pendingLabel="Revoking…" data-testid="confirm-revoke-token">
        Yes, revoke
      </SubmitButton>
      <Button variant="quiet" size="sm" onClick={() => setConfirming(false)}>
        Cancel
      </Button>
      {state.message && !state.ok && (
        <span role="alert" className="text-xs text-brick-700">
          ✕ {state.message}
        </span>
      )}
    </form>
  );
}
