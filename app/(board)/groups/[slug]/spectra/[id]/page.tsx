import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { cache } from 'react';
import { reviewAbilities } from '@/components/review/review-abilities';
import { ReviewWorkspace } from '@/components/review/review-workspace';
import { allowedActions } from '@/lib/auth/permissions';
import { AppError } from '@/lib/errors';
import { groupContext } from '@/lib/http/page';
import { getSpectrum } from '@/lib/services/spectra';

type Params = { slug: string; id: string };

/** The spectrum as its group's member sees it; absent, or of another group, is the 404 page. */
const load = cache(async (slug: string, id: string) => {
  const { em, caller } = await groupContext(slug);
  try {
    const spectrum = await getSpectrum(em, caller, id);
    if (spectrum.group.slug !== slug) notFound();
    return { spectrum, userId: caller.userId };
  } catch (e) {
    if (e instanceof AppError && e.code === 'not_found') notFound();
    throw e;
  }
});

export async function generateMetadata({ params }: { params: Promise<Params> }): Promise<Metadata> {
  const { slug, id } = await params;
  return { title: (await load(slug, id)).spectrum.title };
}

export default async function SpectrumPage({ params }: { params: Promise<Params> }) {
  const { slug, id } = await params;
  const { spectrum, userId } = await load(slug, id);
  // What the caller may do is decided here, on the server; the workspace only hides the rest.
  const can = reviewAbilities(allowedActions(spectrum.role), spectrum.submitter?.id === userId);
  // The first copy comes from the server; the workspace then follows the API.
  return <ReviewWorkspace initial={spectrum} can={can} userId={userId} />;
}
