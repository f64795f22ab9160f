import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { cache } from 'react';
import { groupContext } from '@/lib/http/page';
import { AppError } from '@/lib/errors';
import { getSpectrum } from '@/lib/services/spectra';
import { SpectrumView } from '@/components/spectra/spectrum-view';

type Params = { slug: string; id: string };

/** The spectrum as its group's member sees it; absent, or of another group, is the 404 page. */
const load = cache(async (slug: string, id: string) => {
  const { em, caller } = await groupContext(slug);
  try {
    const spectrum = await getSpectrum(em, caller, id);
    if (spectrum.group.slug !== slug) notFound();
    return spectrum;
  } catch (e) {
    if (e instanceof AppError && e.code === 'not_found') notFound();
    throw e;
  }
});

export async function generateMetadata({ params }: { params: Promise<Params> }): Promise<Metadata> {
  const { slug, id } = await params;
  return { title: (await load(slug, id)).title };
}

export default async function SpectrumPage({ params }: { params: Promise<Params> }) {
  const { slug, id } = await params;
  // The first copy comes from the server; the page then follows the API (screening, revisions).
  return <SpectrumView initial={await load(slug, id)} />;
}
