'use client';

import { signOut } from 'next-auth/react';
import { useState } from 'react';

export function SignOutButton() {
  const [pending, setPending] = useState(false);
  return (
    <button
      type="button"
      data-testid="sign-out"
      disabled={pending}
      onClick={() => {
        setPending(true);
        void signOut({ callbackUrl: '/sign-in' });
      }}
      className="inline-flex h-8 items-center rounded-md border border-ink-700 px-2.5 text-xs font-medium text-paper-100 hover:border-ink-400 hover:bg-ink-800 disabled:opacity-60"
    >
      {pending ? 'Signing out…' : 'Sign out'}
    </button>
  );
}
