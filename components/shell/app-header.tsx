import Link from 'next/link';
import { LogoMark } from './logo-mark';
import { NavLink } from './nav-link';
import { SignOutButton } from './sign-out-button';

export type HeaderGroup = { slug: string; name: string };

export function AppHeader({ user, groups }: { user: { name: string | null; email: string }; groups: HeaderGroup[] }) {
  // Show a handful of groups in the bar; the home page lists them all.
  const shown = groups.slice(0, 5);
  return (
    <header className="border-b border-ink-950 bg-ink-900 text-paper-100">
      <div className="mx-auto flex max-w-6xl items-center gap-4 px-4 sm:px-6">
        <Link href="/" className="flex h-12 items-center gap-2 font-semibold tracking-tight text-paper-50 no-underline" data-testid="home-link">
          <LogoMark />
          <span>Branchwise</span>
        </Link>
        <nav aria-label="Groups" className="hidden min-w-0 flex-1 items-center overflow-x-auto sm:flex">
          <NavLink href="/" exact>
            My groups
          </NavLink>
          {shown.map((g) => (
            <NavLink key={g.slug} href={`/groups/${g.slug}`}>
              {g.name}
            </NavLink>
          ))}
          {groups.length > shown.length && (
            <Link href="/" className="px-2.5 text-sm text-ink-100 no-underline hover:text-paper-50">
              +{groups.length - shown.length} more
            </Link>
          )}
        </nav>
        <div className="ml-auto flex min-w-0 items-center gap-2">
          <NavLink href="/account" testId="account-link">
            <span className="max-w-[9rem] truncate sm:max-w-[12rem]">{user.name || user.email}</span>
          </NavLink>
          <SignOutButton />
        </div>
      </div>
    </header>
  );
}
