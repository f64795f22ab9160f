import type { Metadata } from 'next';
import Link from 'next/link';
import { groupContext } from '@/lib/http/page';
import { can } from '@/lib/auth/permissions';
import { listMembers } from '@/lib/services/members';
import { queueSummary } from '@/lib/services/spectra';
import { SPECTRUM_STATUSES } from '@/lib/client/spectra-types';
import { FileNotReadMark, StatusBadge } from '@/components/spectra/status-badge';
import { PageHeader } from '@/components/shell/page-header';
import { Panel } from '@/components/ui/panel';
import { RoleBadge } from '@/components/ui/badge';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ROLE_ABILITIES } from '@/components/members/role-abilities';

type Params = { slug: string };

export async function generateMetadata({ params }: { params: Promise<Params> }): Promise<Metadata> {
  const { group } = await groupContext((await params).slug);
  return { title: group.name };
}

export default async function GroupPage({ params }: { params: Promise<Params> }) {
  const { slug } = await params;
  const { em, caller, group, role } = await groupContext(slug);
  const members = await listMembers(em, group.id);
  const summary = await queueSummary(em, caller, group.slug);
  const queue = `/groups/${group.slug}/spectra`;
  const actions = (
    <div className="flex flex-wrap gap-2">
      <Link href={queue} className={buttonClasses('primary')} data-testid="spectra-link">
        Open the review queue
      </Link>
      {can(role, 'spectrum.create') && (
        <Link href={`${queue}/new`} className={buttonClasses('secondary')}>
          New spectrum
        </Link>
      )}
    </div>
  );

  return (
    <>
      <PageHeader
        title={group.name}
        badge={<RoleBadge role={role} />}
        crumbs={[{ href: '/', label: 'My groups' }]}
        actions={
          <div className="flex flex-wrap gap-2">
            <Link href={`/groups/${group.slug}/members`} className={buttonClasses('secondary')} data-testid="members-link">
              Members ({members.length})
            </Link>
            <Link href={`/groups/${group.slug}/settings`} className={buttonClasses('secondary')} data-testid="settings-link">
              Review policy
            </Link>
            {can(role, 'audit.read') && (
              <Link href={`/groups/${group.slug}/audit`} className={buttonClasses('secondary')} data-testid="audit-link">
                Audit log
              </Link>
            )}
          </div>
        }
      />

      <div className="grid gap-5 lg:grid-cols-[1fr_18rem]">
        <Panel title="Spectra" description="The group's review queue at a glance" data-testid="spectra-panel">
          {summary.total === 0 ? (
            <EmptyState title="No spectra yet" action={actions}>
              Submitters upload band files, screening runs on each revision, and reviewers see what waits for a decision.
              Screening is an aid to review, not a verdict on the physics.
            </EmptyState>
          ) : (
            <div className="flex flex-col gap-4">
              {summary.waitingOnMe !== null && (
                <p className="text-sm text-paper-800" data-testid="waiting-on-me">
                  <Link href={`${queue}?mine=waiting`} className="font-semibold">
                    {summary.waitingOnMe === 1 ? '1 spectrum waits' : `${summary.waitingOnMe} spectra wait`} on your decision
                  </Link>
                </p>
              )}
              <ul className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-2" aria-label="Spectra by status">
                {SPECTRUM_STATUSES.filter((st) => summary.byStatus[st] > 0).map((st) => (
                  <li key={st} className="flex items-center justify-between gap-3 border-b border-paper-200 pb-2" data-testid={`summary-${st}`}>
                    <Link href={`${queue}?status=${st}`} className="no-underline" aria-label={`${summary.byStatus[st]} ${st.replace('-', ' ')}: show them in the queue`}>
                      <StatusBadge status={st} />
                    </Link>
                    <span className="tabular font-semibold text-paper-900">{summary.byStatus[st]}</span>
                  </li>
                ))}
                {summary.fileNotRead > 0 && (
                  <li className="flex items-center justify-between gap-3 border-b border-paper-200 pb-2" data-testid="summary-file-not-read">
                    <Link
                      href={`${queue}?status=screening&screening=error`}
                      className="no-underline"
                      aria-label={`${summary.fileNotRead} of those in screening have a file that did not parse: show them in the queue`}
                    >
                      <span className="flex items-center gap-1.5 text-xs text-paper-700">
                        of them <FileNotReadMark />
                      </span>
                    </Link>
                    <span className="tabular font-semibold text-paper-900">{summary.fileNotRead}</span>
                  </li>
                )}
              </ul>
              {actions}
            </div>
          )}
        </Panel>

        <div className="space-y-5">
          <Panel title="Group" level={2}>
            <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 text-sm">
              <dt className="text-paper-600">Members</dt>
              <dd className="tabular font-semibold" data-testid="member-count">
                {members.length}
              </dd>
              <dt className="text-paper-600">Short name</dt>
              <dd>
                <code>{group.slug}</code>
              </dd>
              <dt className="text-paper-600">Your role</dt>
              <dd>
                <RoleBadge role={role} />
              </dd>
            </dl>
          </Panel>
          <Panel title={`As ${role} you can`}>
            <ul className="list-disc space-y-1 pl-4 text-sm text-paper-700">
              {ROLE_ABILITIES[role].map((a) => (
                <li key={a}>{a}</li>
              ))}
            </ul>
          </Panel>
        </div>
      </div>
    </>
  );
}
