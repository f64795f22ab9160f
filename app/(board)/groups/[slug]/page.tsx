import type { Metadata } from 'next';
import Link from 'next/link';
import { groupContext } from '@/lib/http/page';
import { can } from '@/lib/auth/permissions';
import { listMembers } from '@/lib/services/members';
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
  const { em, group, role } = await groupContext(slug);
  const members = await listMembers(em, group.id);

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
        <Panel title="Spectra" description="The group's review queue" data-testid="spectra-panel">
          <EmptyState
            title="Review the group's spectra"
            action={
              <div className="flex flex-wrap justify-center gap-2">
                <Link href={`/groups/${group.slug}/spectra`} className={buttonClasses('primary')} data-testid="spectra-link">
                  Open the review queue
                </Link>
                {can(role, 'spectrum.create') && (
                  <Link href={`/groups/${group.slug}/spectra/new`} className={buttonClasses('secondary')}>
                    New spectrum
                  </Link>
                )}
              </div>
            }
          >
            Submitters upload band files, screening runs on each revision, and reviewers see what waits for a decision.
            Screening is an aid to review, not a verdict on the physics.
          </EmptyState>
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
