'use client';

import { useMemo, useState, type ReactNode } from 'react';
import { SeverityMark } from '@/components/spectra/severity-mark';
import { VerdictBadge } from '@/components/spectra/verdict-badge';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { cx } from '@/components/ui/cx';
import { formatMinute } from '@/components/ui/format';
import { Panel } from '@/components/ui/panel';
import type { StoredFindingDto, VerdictValue } from '@/lib/client/spectra-types';
import { findingRuns } from '@/lib/review/finding-runs';
import { personName } from './person-name';
import { WaiveForm } from './waive-form';

const fmt = (x: number | null) => (x === null ? '—' : Number.isInteger(x) ? String(x) : x.toFixed(3));

export function findingPlace(f: Pick<StoredFindingDto, 'segment' | 'index' | 'branch'>): string {
  const parts: string[] = [];
  if (f.segment !== null) parts.push(`segment ${f.segment}`);
  if (f.index !== null) parts.push(`q-point ${f.index}`);
  if (f.branch !== null) parts.push(`branch ${f.branch}`);
  return parts.length ? parts.join(' · ') : 'whole file';
}

export interface FindingsPanelProps {
  spectrumId: string;
  /** The screened revision the findings belong to (its screening is refreshed after a waiver). */
  revisionId: string;
  /** Each with its waiver (`waived`) as the screening JSON carries it. */
  findings: StoredFindingDto[];
  /** The screening's verdict (every finding) and the spectrum's (waived ones left out). */
  screeningVerdict: VerdictValue;
  effectiveVerdict: VerdictValue | null;
  highlighted: string | null;
  onShow: (f: StoredFindingDto) => void;
  onDiscuss?: (f: StoredFindingDto) => void;
  canWaive: boolean;
  /** Waivers are taken only while the spectrum is open for review. */
  waivable: boolean;
}

/** Shortcuts shown at most: a pathological file can have a run on hundreds of branches. */
const MAX_SHORTCUTS = 6;

function SelectToggle({ pressed, onToggle, testId, children }: { pressed: boolean; onToggle: (on: boolean) => void; testId: string; children: ReactNode }) {
  return (
    <Button variant={pressed ? 'secondary' : 'quiet'} size="sm" aria-pressed={pressed} onClick={() => onToggle(!pressed)} data-testid={testId}>
      <span aria-hidden="true" className="inline-block w-3 text-center">
        {pressed ? '✓' : '+'}
      </span>
      {children}
    </Button>
  );
}

/** Every finding of the current revision; waived ones stay, marked, and stop counting. */
export function FindingsPanel(p: FindingsPanelProps) {
  const [waiving, setWaiving] = useState<string | null>(null);
  const [picked, setPicked] = useState<ReadonlySet<string>>(new Set());
  const [waivingPicked, setWaivingPicked] = useState(false);
  const waivedCount = p.findings.filter((f) => f.waived).length;
  const open = useMemo(() => p.findings.filter((f) => !f.waived).map((f) => f.id), [p.findings]);
  const runs = useMemo(() => findingRuns(p.findings), [p.findings]);
  const selectable = p.canWaive && p.waivable && open.length > 1;
  // A finding waived meanwhile (another tab, another reviewer) drops out of the selection.
  const selected = open.filter((id) => picked.has(id));
  const allIn = (ids: string[]) => ids.length > 0 && ids.every((id) => picked.has(id));
  const toggle = (ids: string[], on: boolean) => {
    const next = new Set(picked);
    for (const id of ids) {
      if (on) next.add(id);
      else next.delete(id);
    }
    setPicked(next);
  };
  return (
    <Panel
      title={`Findings (${p.findings.length})`}
      description="Points and branches are counted from 0; branch k is the k-th lowest frequency at its q-point."
      actions={
        <span className="flex flex-wrap items-center gap-x-3 gap-y-1 text-xs text-paper-700" data-testid="verdicts">
          <span className="flex items-center gap-1.5">
            Screening <VerdictBadge verdict={p.screeningVerdict} />
          </span>
          <span className="flex items-center gap-1.5" data-testid="verdict-after-waivers">
            After waivers <VerdictBadge verdict={p.effectiveVerdict} />
          </span>
        </span>
      }
      flush
      data-testid="findings"
    >
      {p.findings.length === 0 ? (
        <p className="px-4 py-5 text-paper-700" data-testid="no-findings">
          No check raised anything for this revision.
        </p>
      ) : (
        <>
          {waivedCount > 0 && (
            <p className="border-b border-paper-200 px-4 py-2 text-xs text-paper-700">
              {waivedCount} of {p.findings.length} waived: still listed, no longer counted toward the verdict or the approval rule.
            </p>
          )}
          {selectable && (
            <div className="flex flex-col gap-2 border-b border-paper-200 px-4 py-2 text-xs" role="group" aria-label="Waive several findings" data-testid="findings-selection">
              <div className="flex flex-wrap items-center gap-2">
                <span className="tabular text-paper-800" aria-live="polite" data-testid="selected-count">
                  {selected.length} of {open.length} open findings selected
                </span>
                {/* Toggle buttons keep their name; pressed shows as a tick and a filled button, not by colour alone. */}
                <SelectToggle pressed={allIn(open)} onToggle={(on) => toggle(open, on)} testId="select-all-open">
                  Select all {open.length} open
                </SelectToggle>
                {runs.slice(0, MAX_SHORTCUTS).map((r) => (
                  <SelectToggle key={`${r.check}-${r.branch}`} pressed={allIn(r.ids)} onToggle={(on) => toggle(r.ids, on)} testId="select-run">
                    Select all {r.ids.length} {r.check} on branch {r.branch}
                  </SelectToggle>
                ))}
                {selected.length > 0 && (
                  <Button variant="quiet" size="sm" onClick={() => setPicked(new Set())} data-testid="clear-selection">
                    Clear selection
                  </Button>
                )}
                <Button
                  variant="secondary"
                  size="sm"
                  className="ml-auto"
                  disabled={selected.length === 0}
                  aria-expanded={waivingPicked}
                  onClick={() => setWaivingPicked(!waivingPicked)}
                  data-testid="waive-selected"
                >
                  {selected.length > 0 ? `Waive ${selected.length} selected…` : 'Waive selected…'}
                </Button>
              </div>
              {waivingPicked && selected.length > 0 && (
                <WaiveForm
                  spectrumId={p.spectrumId}
                  revisionId={p.revisionId}
                  findingIds={selected}
                  onDone={() => {
                    setWaivingPicked(false);
                    setPicked(new Set());
                  }}
                />
              )}
            </div>
          )}
          <ol className="divide-y divide-paper-200" data-testid="findings-table">
            {p.findings.map((f) => {
              const w = f.waived;
              const shown = p.highlighted === f.id;
              return (
                <li
                  key={f.id}
                  className={cx('px-4 py-3 text-sm', shown && 'bg-ember-50', w && 'bg-paper-50')}
                  data-testid={`finding-${f.check}`}
                  data-finding={f.id}
                  data-waived={w ? 'yes' : 'no'}
                >
                  <div className="flex flex-wrap items-start justify-between gap-2">
                    <div className="flex min-w-0 flex-wrap items-center gap-x-3 gap-y-1">
                      {selectable && !w && (
                        <input
                          type="checkbox"
                          className="h-4 w-4 accent-ink-800"
                          checked={picked.has(f.id)}
                          onChange={(e) => toggle([f.id], e.target.checked)}
                          aria-label={`Select ${f.check} at ${findingPlace(f)}`}
                          data-testid="finding-select"
                        />
                      )}
                      <SeverityMark severity={f.severity} muted={Boolean(w)} />
                      <code className="text-paper-900">{f.check}</code>
                      <span className="tabular text-xs text-paper-700">{findingPlace(f)}</span>
                      {f.value !== null && (
                        <span className="tabular text-xs text-paper-700">
                          value {fmt(f.value)} / limit {fmt(f.limit)} THz
                        </span>
                      )}
                      {w && (
                        <Badge tone="neutral" shape="ring" title="Waived: not counted" data-testid="waived">
                          waived
                        </Badge>
                      )}
                    </div>
                    <div className="flex shrink-0 gap-1.5">
                      {f.index !== null && (
                        <Button variant={shown ? 'secondary' : 'quiet'} size="sm" aria-pressed={shown} onClick={() => p.onShow(f)} data-testid="finding-show">
                          {shown ? 'Shown on plot' : 'Show on plot'}
                        </Button>
                      )}
                      {p.onDiscuss && (
                        <Button variant="quiet" size="sm" onClick={() => p.onDiscuss!(f)} data-testid="finding-discuss">
                          Discuss
                        </Button>
                      )}
                      {p.canWaive && p.waivable && !w && (
                        <Button variant="secondary" size="sm" aria-expanded={waiving === f.id} onClick={() => setWaiving(waiving === f.id ? null : f.id)} data-testid="finding-waive">
                          Waive…
                        </Button>
                      )}
                    </div>
                  </div>
                  <p className={cx('mt-1 max-w-prose text-paper-800', w && 'text-paper-600')}>{f.message}</p>
                  {w && (
                    <p className="mt-1 border-l-2 border-paper-400 pl-2 text-xs text-paper-700" data-testid="waiver-reason">
                      Waived by {personName(w.by)} on {formatMinute(w.at)}: “{w.reason}”
                    </p>
                  )}
                  {waiving === f.id && <WaiveForm spectrumId={p.spectrumId} revisionId={p.revisionId} findingIds={[f.id]} onDone={() => setWaiving(null)} />}
                </li>
              );
            })}
          </ol>
        </>
      )}
    </Panel>
  );
}
