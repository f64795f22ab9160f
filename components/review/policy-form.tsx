'use client';

import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { formatMinute } from '@/components/ui/format';
import { Input } from '@/components/ui/input';
import { Panel } from '@/components/ui/panel';
import { savePolicy } from '@/lib/client/review/review-api';
import type { PolicyDto } from '@/lib/client/review/review-types';
import { usePolicy } from '@/lib/client/review/use-review';
import { useQueryClient } from '@tanstack/react-query';
import { reviewKeys } from '@/lib/client/review/review-api';
import { errorText } from './error-text';
import { personName } from './person-name';
import { CHECK_WORDS, THRESHOLD_WORDS } from './policy-words';

type Checks = Record<string, Record<string, unknown>>;
const SEVERITIES = ['info', 'warn', 'fail'] as const;

/** What changed against the loaded policy: only those keys are sent. */
function changes(p: PolicyDto, approvals: number, severities: string[], checks: Checks) {
  const out: { requiredApprovals?: number; blockingSeverities?: string[]; checks?: Checks } = {};
  if (approvals !== p.requiredApprovals) out.requiredApprovals = approvals;
  if ([...severities].sort().join() !== [...p.blockingSeverities].sort().join()) out.blockingSeverities = severities;
  const c: Checks = {};
  const current = p.checks as unknown as Checks;
  for (const [check, values] of Object.entries(checks)) {
    for (const [k, v] of Object.entries(values)) if (current[check]?.[k] !== v) (c[check] ??= {})[k] = v;
  }
  if (Object.keys(c).length) out.checks = c;
  return out;
}

/**
 * The group's review policy: approvals needed, which severities block, each check's thresholds
 * next to the engine's defaults. Admins edit; everyone else reads. Changes apply to new screenings.
 */
export function PolicyForm({ slug, initial, canEdit }: { slug: string; initial: PolicyDto; canEdit: boolean }) {
  const qc = useQueryClient();
  const q = usePolicy(slug);
  const policy = q.data ?? initial;
  const [approvals, setApprovals] = useState(String(policy.requiredApprovals));
  const [severities, setSeverities] = useState<string[]>(policy.blockingSeverities);
  const [checks, setChecks] = useState<Checks>(() => structuredClone(policy.checks as unknown as Checks));
  const [state, setState] = useState<{ error?: string; saved?: boolean; pending?: boolean }>({});

  const setValue = (check: string, key: string, value: unknown) => setChecks((c) => ({ ...c, [check]: { ...c[check], [key]: value } }));
  const defaults = policy.defaults.checks as unknown as Checks;

  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    const n = Number(approvals);
    if (!Number.isInteger(n) || n < 1 || n > 10) return setState({ error: 'Required approvals: a whole number from 1 to 10.' });
    for (const [check, values] of Object.entries(checks))
      for (const [k, v] of Object.entries(values))
        if (typeof v === 'number' && !Number.isFinite(v)) return setState({ error: `${CHECK_WORDS[check]?.title ?? check}: "${THRESHOLD_WORDS[check]?.[k]?.label ?? k}" must be a number.` });
    const body = changes(policy, n, severities, checks);
    if (Object.keys(body).length === 0) return setState({ error: 'Nothing changed.' });
    setState({ pending: true });
    try {
      const saved = await savePolicy(slug, body);
      qc.setQueryData(reviewKeys.policy(slug), saved);
      setChecks(structuredClone(saved.checks as unknown as Checks));
      setSeverities(saved.blockingSeverities);
      setState({ saved: true });
    } catch (err) {
      setState({ error: errorText(err) });
    }
  };

  return (
    <form onSubmit={submit} className="flex flex-col gap-5" data-testid="policy-form">
      {!canEdit && <Alert tone="info">Only the group&apos;s admins change the policy; you can read it here.</Alert>}
      <Panel title="Approval" description="When a spectrum in review becomes approved by itself.">
        <fieldset disabled={!canEdit} className="flex flex-col gap-4">
          <Field label="Approvals needed on the current revision" hint={`Distinct reviewers or admins, 1 to 10. Default ${policy.defaults.requiredApprovals}.`}>
            <Input type="number" min={1} max={10} value={approvals} onChange={(e) => setApprovals(e.target.value)} className="max-w-[7rem]" data-testid="policy-approvals" />
          </Field>
          <div role="group" aria-labelledby="blocking-severities" className="flex flex-col gap-1">
            <span id="blocking-severities" className="text-xs font-semibold text-paper-800">
              Unwaived findings that block approval
            </span>
            {SEVERITIES.map((sev) => (
              <label key={sev} className="flex items-center gap-2 text-sm">
                <input
                  type="checkbox"
                  className="accent-ink-800"
                  checked={severities.includes(sev)}
                  disabled={sev === 'fail' || !canEdit}
                  onChange={(e) => setSeverities((s) => (e.target.checked ? [...s, sev] : s.filter((x) => x !== sev)))}
                  data-testid={`policy-block-${sev}`}
                />
                {sev}
                {sev === 'fail' && <span className="text-xs text-paper-600">(always: an unwaived failure blocks)</span>}
              </label>
            ))}
          </div>
        </fieldset>
      </Panel>

      <Panel title="Screening thresholds" description="Apply to revisions screened after the change; earlier screenings keep their findings." flush>
        <fieldset disabled={!canEdit} className="divide-y divide-paper-200">
          <legend className="sr-only">Screening thresholds</legend>
          {Object.entries(checks).map(([check, values]) => (
            <div key={check} className="grid gap-3 px-4 py-3 md:grid-cols-[14rem_1fr]" data-testid={`policy-check-${check}`}>
              <div>
                <label className="flex items-center gap-2 text-sm font-semibold text-paper-900">
                  <input type="checkbox" className="accent-ink-800" checked={values.enabled === true} onChange={(e) => setValue(check, 'enabled', e.target.checked)} />
                  {CHECK_WORDS[check]?.title ?? check}
                </label>
                <p className="mt-0.5 text-xs text-paper-600">{CHECK_WORDS[check]?.what}</p>
                <code className="text-2xs text-paper-600">{check}</code>
              </div>
              <div className="grid gap-3 sm:grid-cols-2">
                {Object.entries(values)
                  .filter(([k]) => k !== 'enabled')
                  .map(([k, v]) => {
                    const words = THRESHOLD_WORDS[check]?.[k];
                    const def = defaults[check]?.[k];
                    return (
                      <Field key={k} label={`${words?.label ?? k}${words?.unit ? ` (${words.unit})` : ''}`} hint={`Default ${String(def)}${def !== v ? ' · changed' : ''}`}>
                        <Input
                          type="number"
                          step="any"
                          value={Number.isFinite(v as number) ? String(v) : ''}
                          onChange={(e) => setValue(check, k, e.target.value === '' ? NaN : Number(e.target.value))}
                          className="max-w-[10rem]"
                          data-testid={`policy-${check}-${k}`}
                        />
                      </Field>
                    );
                  })}
              </div>
            </div>
          ))}
        </fieldset>
      </Panel>

      {state.error && <Alert tone="error" data-testid="policy-error">{state.error}</Alert>}
      {state.saved && <Alert tone="success" data-testid="policy-saved">Saved. New screenings use these values.</Alert>}
      <div className="flex items-center justify-between gap-3">
        <p className="text-xs text-paper-600">
          {policy.updatedAt ? `Last changed by ${personName(policy.updatedBy)} on ${formatMinute(policy.updatedAt)}.` : 'The engine defaults; never changed.'}
        </p>
        {canEdit && (
          <Button type="submit" disabled={state.pending} data-testid="policy-save">
            {state.pending ? 'Saving…' : 'Save policy'}
          </Button>
        )}
      </div>
    </form>
  );
}
