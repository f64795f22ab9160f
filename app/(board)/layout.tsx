import type { ReactNode } from 'react';
import { pageContext } from '@/lib/http/page';
import { listMyGroups } from '@/lib/services/groups';
import { AppHeader } from '@/components/shell/app-header';

// Every page under (board) is for signed-in people: pageContext() sends others to /sign-in.
export default async function BoardLayout({ children }: { children: ReactNode }) {
  const { em, user } = await pageContext();
  const groups = await listMyGroups(em, user.id);
  return (
    <div className="flex min-h-screen flex-col">
      <AppHeader user={user} groups={groups.map((g) => ({ slug: g.slug, name: g.name }))} />
      <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 py-6 sm:px-6">
        {children}
      </main>
      <footer className="border-t border-paper-200 py-4 text-center text-2xs text-paper-600">
        Branchwise · screening is an aid to review, not a verdict on the physics
      </footer>
    </div>
  );
}
