import type { Metadata } from 'next';
import { Suspense } from 'react';
import { groupContext } from '@/lib/http/page';
import { can } from '@/lib/auth/permissions';
import { PageHeader } from '@/components/shell/page-header';
import { RoleBadge } from '@/components/ui/badge';
import { SpectraQueue } from '@/components/spectra/spectra-queue';

type Params = { slug: string };

export async function generateMetadata({ params }: { params: Promise<Params> }): Promise<Metadata> {
  const { group } = await groupContext((await params).slug);
  return { title: `Spectra · ${group.name}` };
}

export default async function SpectraQueuePage({ params }: { params: Promise<Params> }) {
  const { slug } = await params;
  const { group, role } = await groupContext(slug);
  return (
    <>
      <PageHeader
        title="Spectra"
        badge={<RoleBadge role={role} />}
        crumbs={[
          { href: '/', label: 'My groups' },
          { href: `/groups/${group.slug}`, label: group.name },
        ]}
        lead="Every spectrum of the group with its review status and the current revision's screening verdict."
      />
      {/* The queue reads its list state from the URL (useSearchParams). */}
      <Suspense>
        <SpectraQueue group={group.slug} groupName={group.name} canCreate={can(role, 'spectrum.create')} />
      </Suspense>
    </>
  );
}
