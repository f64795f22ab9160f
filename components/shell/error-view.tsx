'use client';

import Link from 'next/link';
import { Button } from '@/components/ui/button';

/** Something failed on our side. The digest lets whoever runs the server find it in the logs. */
export function ErrorView({ digest, reset }: { digest?: string; reset: () => void }) {
  return (
    <div className="mx-auto max-w-lg py-16 text-center" data-testid="error-view">
      <p className="text-xs font-semibold uppercase tracking-wider text-brick-700">Something went wrong</p>
      <h1 className="mt-1 text-xl font-semibold tracking-tight">This page could not be shown</h1>
      <p className="mt-2 text-paper-700">
        The problem is on our side and nothing you entered was lost. Try again; if it keeps happening, tell whoever runs
        Branchwise for your group{digest ? ' and give them the reference below' : ''}.
      </p>
      {digest && (
        <p className="mt-3 text-xs text-paper-600">
          Reference: <code>{digest}</code>
        </p>
      )}
      <div className="mt-5 flex justify-center gap-3">
        <Button onClick={reset}>Try again</Button>
        <Link href="/" className="inline-flex h-9 items-center">
          Back to my groups
        </Link>
      </div>
    </div>
  );
}
