'use client';

import { useEffect, useRef } from 'react';
import { useRouter } from 'next/navigation';

/**
 * After a successful action, re-render the server data around it: once per result (the router
 * object is not stable across refreshes, so it must not be an effect dependency).
 */
export function useRefreshOnOk(state: { ok: boolean }) {
  const router = useRouter();
  const routerRef = useRef(router);
  useEffect(() => {
    routerRef.current = router;
  }, [router]);
  useEffect(() => {
    if (state.ok) routerRef.current.refresh();
  }, [state]);
}
