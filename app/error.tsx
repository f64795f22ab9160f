'use client';

import { ErrorView } from '@/components/shell/error-view';

export default function RootError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main id="main" className="px-4">
      <ErrorView digest={error.digest} reset={reset} />
    </main>
  );
}
