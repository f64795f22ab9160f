'use client';

import { useEffect } from 'react';
import { useRouter } from 'next/navigation';

/** After a successful action, re-render the server data around it. */
export function useRefreshOnOk(state: { ok: boolean }) {
  const router = useRouter();
  useEffect(() => {
    if (state.ok) router.refresh();
  }, [state, router]);
}
