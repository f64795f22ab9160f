'use client';

import { ErrorView } from '@/components/shell/error-view';

export default function BoardError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return <ErrorView digest={error.digest} reset={reset} />;
}
