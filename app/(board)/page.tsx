import type { Metadata } from 'next';
import Link from 'next/link';
import { pageContext } from '@/lib/http/page';
import { listMyGroups } from '@/lib/services/groups';
import { PageHeader } from '@/components/shell/page-header';
import { Panel } from '@/components/ui/panel';
import { RoleBadge, ROLE_HELP } from '@/components/ui/badge';
import { EmptyState } from '@/components/ui/empty-state';

export const metadata: Metadata = { title: 'My groups' };

export default async function HomePage() {
  const { em, user } = await pageContext();
  const groups = await listMyGroups(em, user.id);
  const first = (user.name || user.email).split(/[\s@]/)[0];

  return (
    <>
      <PageHeader title="My groups" lead={`Signed in as ${user.email}. Your role is set per group by its admins.`} />
      <Panel
        title={`Hello, ${first}`}
        description={groups.length === 1 ? 'You belong to one group.' : `You belong to ${groups.length} groups.`}
        flush
      >
        {groups.length === 0 ? (
          <EmptyState title="You are not in a group yet" data-testid="no-groups">
            Groups are joined by invitation. Ask an admin of your group to invite {user.email}.
          </EmptyState>
        ) : (
          <ul className="divide-y divide-paper-200" data-testid="my-groups">
            {groups.map((g) => (
              <li key={g.slug} className="flex flex-wrap items-center gap-x-4 gap-y-1 px-4 py-3" data-testid={`group-${g.slug}`}>
                <div className="min-w-0 flex-1">
                  <Link href={`/groups/${g.slug}`} className="font-semibold">
                    {g.name}
                  </Link>
                  <p className="text-xs text-paper-600">{ROLE_HELP[g.role]}</p>
                </div>
                <span className="tabular text-xs text-paper-600">
                  {g.members} {g.members === 1 ? 'member' : 'members'}
                </span>
                <RoleBadge role={g.role} />
                <Link href={`/groups/${g.slug}/members`} className="text-xs">
                  Members
                </Link>
              </li>
            ))}
          </ul>
        )}
      </Panel>
    </>
  );
}
