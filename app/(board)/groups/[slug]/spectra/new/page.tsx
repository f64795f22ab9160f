import type { Metadata } from 'next';
import Link from 'next/link';
import { groupContext } from '@/lib/http/page';
import { can } from '@/lib/auth/permissions';
import { PageHeader } from '@/components/shell/page-header';
import { Alert } from '@/components/ui/alert';
import { NewSpectrumForm } from '@/components/spectra/new-spectrum-form';

type Params = { slug: string };

export const metadata: Metadata = { title: 'New spectrum' };

export default async function NewSpectrumPage({ params }: { params: Promise<Params> }) {
  const { slug } = await params;
  const { group, role } = await groupContext(slug);
  const crumbs = [
    { href: '/', label: 'My groups' },
    { href: `/groups/${group.slug}`, label: group.name },
    { href: `/groups/${group.slug}/spectra`, label: 'Spectra' },
  ];

  if (!can(role, 'spectrum.create')) {
    return (
      <>
        <PageHeader title="New spectrum" crumbs={crumbs} />
        <Alert tone="warning" title="Your role cannot add spectra" data-testid="create-forbidden">
          As {role} in {group.name} you can read the queue but not upload. An admin of the group can make you a submitter.{' '}
          <Link href={`/groups/${group.slug}/spectra`}>Back to the queue</Link>
        </Alert>
      </>
    );
  }

  return (
    <>
      <PageHeader
        title="New spectrum"
        crumbs={crumbs}
        lead="Describe the calculation and upload its band file. Screening starts as soon as the file is stored; the spectrum then waits for review."
      />
      <NewSpectrumForm group={group.slug} />
    </>
  );
}
