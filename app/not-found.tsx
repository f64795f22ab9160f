import type { Metadata } from 'next';
import Link from 'next/link';
import { LogoMark } from '@/components/shell/logo-mark';
import { NotFoundView } from '@/components/shell/not-found-view';

export const metadata: Metadata = { title: 'Not found' };

export default function NotFound() {
  return (
    <>
      <header className="border-b border-ink-950 bg-ink-900">
        <div className="mx-auto flex h-12 max-w-6xl items-center px-4 sm:px-6">
          <Link href="/" className="flex items-center gap-2 font-semibold text-paper-50 no-underline">
            <LogoMark />
            Branchwise
          </Link>
        </div>
      </header>
      <main id="main" className="px-4">
        <NotFoundView />
      </main>
    </>
  );
}
