'use client';

import { useEffect, useRef } from 'react';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { Select } from '@/components/ui/select';
import { SubmitButton } from '@/components/ui/submit-button';
import { Alert } from '@/components/ui/alert';
import { CopyButton } from '@/components/ui/copy-button';
import type { FormAction } from '@/components/ui/action-types';
import { useFormAction } from '@/components/ui/use-form-action';
import { useRefreshOnOk } from '@/components/members/use-refresh-on-ok';

type Created = { token: string; id?: string };

export function CreateTokenForm({
  groups,
  action,
}: {
  groups: { slug: string; name: string }[];
  action: FormAction<Created>;
}) {
  const { state, formAction, onSubmit, pending } = useFormAction(action);
  const formRef = useRef<HTMLFormElement>(null);
  useRefreshOnOk(state);
  useEffect(() => {
    if (state.ok) formRef.current?.reset();
  }, [state]);

  if (groups.length === 0) {
    return <p className="text-sm text-paper-600">Tokens belong to one group; you need to be in a group first.</p>;
  }

  const secret = state.ok ? state.data?.token : undefined;
  return (
    <div className="space-y-4">
      <form ref={formRef} action={formAction} onSubmit={onSubmit} className="space-y-3" data-testid="token-form" noValidate>
        <div className="grid gap-3 sm:grid-cols-2">
          <Field label="Token name" errors={state.fieldErrors?.name} hint="Where it will be used, e.g. “cluster upload script”." id="token-name">
            <Input name="name" required maxLength={80} data-testid="token-name" />
          </Field>
          <Field label="Group" errors={state.fieldErrors?.group} hint="The token can act only in this group, with your role there." id="token-group">
            <Select name="group" options={groups.map((g) => ({ value: g.slug, label: g.name }))} data-testid="token-group" />
          </Field>
        </div>
        <div aria-live="polite">
          {!state.ok && state.message && (
            <Alert tone="error" data-testid="token-error">
              {state.message}
            </Alert>
          )}
        </div>
        <SubmitButton pending={pending} pendingLabel="Creating…" data-testid="token-create">
          Create token
        </SubmitButton>
      </form>

      <div aria-live="polite">
        {secret && (
          <Alert tone="warning" title="Copy your new token now" data-testid="token-created">
            <p>This is the only time it is shown. We keep only a hash of it, so it cannot be shown again.</p>
            <div className="mt-2 flex flex-wrap items-center gap-2">
              <code className="select-all break-all rounded border border-ochre-200 bg-paper-0 px-2 py-1 text-paper-900" data-testid="token-secret">
                {secret}
              </code>
              <CopyButton text={secret} label="Copy token" />
            </div>
          </Alert>
        )}
      </div>
    </div>
  );
}
