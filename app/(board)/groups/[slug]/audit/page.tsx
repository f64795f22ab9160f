import type { Metadata } from 'next';
import { Suspense } from 'react';
import { AuditLog } from '@/components/review/audit-log';
import { PageHeader } from '@/components/shell/page-header';
import { Alert } from '@/components/ui/alert';
import { can } from '@/lib/auth/permissions';
import { groupContext } from '@/lib/http/page';
import { listMembers } from '@/lib/services/members';

type Params = { slug: string };

export async function generateMetadata({ params }: { params: Promise<Params> }): Promise<Metadata> {
  const { group } = await groupContext((await params).slug);
  return { title: `Audit log · ${group.name}` };
}

/** Every recorded change in the group, for its admins. */
export default async function AuditPage({ params }: { params: Promise<Params> }) {
  const { slug } = await params;
  const { em, group, role } = await groupContext(slug);
  const header = (
    <PageHeader
      title="Audit log"
      crumbs={[
        { href: '/', label: 'My groups' },
        { href: `/groups/${group.slug}`, label: group.name },
      ]}
      lead="Who changed what and when: decisions, waivers, threads, reviewers, policy, members."
    />
  );
  if (!can(role, 'audit.read')) {
    return (
      <>
        {header}
        <Alert tone="info" data-testid="audit-admins-only">The audit log is for the group&apos;s admins.</Alert>
      </>
    );
  }
  const members = (await listMembers(em, group.id)).map((m) => ({ id: m.userId, name: m.name, email: m.email }));
  return (
    <>
      {header}
      <Suspense>
        <AuditLog slug={slug} members={members} />
      </Suspense>
    </>
  );
}
