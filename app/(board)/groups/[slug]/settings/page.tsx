import type { Metadata } from 'next';
import { PolicyForm } from '@/components/review/policy-form';
import { PageHeader } from '@/components/shell/page-header';
import { can } from '@/lib/auth/permissions';
import { groupContext } from '@/lib/http/page';
import { readPolicy } from '@/lib/services/policy';

type Params = { slug: string };

export async function generateMetadata({ params }: { params: Promise<Params> }): Promise<Metadata> {
  const { group } = await groupContext((await params).slug);
  return { title: `Review policy · ${group.name}` };
}

/** The group's review policy: every member reads it, admins change it. */
export default async function SettingsPage({ params }: { params: Promise<Params> }) {
  const { slug } = await params;
  const { em, caller, group, role } = await groupContext(slug);
  const policy = await readPolicy(em, caller, slug);
  return (
    <>
      <PageHeader
        title="Review policy"
        crumbs={[
          { href: '/', label: 'My groups' },
          { href: `/groups/${group.slug}`, label: group.name },
        ]}
        lead="How many approvals a spectrum needs, what blocks it, and the thresholds of the automatic screening."
      />
      <PolicyForm slug={slug} initial={JSON.parse(JSON.stringify(policy))} canEdit={can(role, 'policy.edit')} />
    </>
  );
}
