import type { Metadata } from 'next';
import { pageContext } from '@/lib/http/page';
import { listMyGroups } from '@/lib/services/groups';
import { listMyTokens } from '@/lib/services/api-tokens';
import { getProfile } from '@/lib/services/account';
import { getNotificationPreferences } from '@/lib/services/notification-preferences';
import { NotificationPreferences } from '@/components/review/notification-preferences';
import { PageHeader } from '@/components/shell/page-header';
import { Panel } from '@/components/ui/panel';
import { isoOf } from '@/components/ui/format';
import { ProfileForm } from '@/components/account/profile-form';
import { PasswordForm } from '@/components/account/password-form';
import { CreateTokenForm } from '@/components/account/create-token-form';
import { TokenList } from '@/components/account/token-list';
import type { TokenRow } from '@/components/account/types';
import { changePassword, createApiToken, revokeApiToken, updateProfile } from './actions';
import { updateNotificationPreferences } from './notification-actions';

export const metadata: Metadata = { title: 'Account' };

export default async function AccountPage() {
  const { em, user } = await pageContext();
  const [groups, tokens, profile, notifications] = await Promise.all([
    listMyGroups(em, user.id),
    listMyTokens(em, user.id),
    getProfile(em, user.id),
    getNotificationPreferences(em, user.id),
  ]);
  const rows: TokenRow[] = tokens.map((t) => ({
    id: t.id,
    name: t.name,
    groupName: t.group.name,
    groupSlug: t.group.slug,
    createdAt: isoOf(t.createdAt),
    lastUsedAt: isoOf(t.lastUsedAt),
    revokedAt: isoOf(t.revokedAt),
    prefix: t.prefix,
  }));

  return (
    <>
      <PageHeader title="Account" lead="Your name, your password, the e-mails you get and the API tokens your scripts use." />
      <div className="grid gap-5 lg:grid-cols-2">
        <Panel title="Profile">
          <ProfileForm name={profile.name} email={profile.email} action={updateProfile} />
        </Panel>
        <Panel title="Password">
          <PasswordForm action={changePassword} hasPassword={profile.hasPassword} />
        </Panel>
        <div className="lg:col-span-2">
          <NotificationPreferences initial={notifications} action={updateNotificationPreferences} />
        </div>
        <Panel
          className="lg:col-span-2"
          title="API tokens"
          description="For scripts that call the Branchwise API (Authorization: Bearer …). Each token works in one group and can be revoked at any time."
        >
          <CreateTokenForm groups={groups.map((g) => ({ slug: g.slug, name: g.name }))} action={createApiToken} />
        </Panel>
        <Panel className="lg:col-span-2" title="Your tokens" flush>
          <TokenList tokens={rows} revoke={revokeApiToken} />
        </Panel>
      </div>
    </>
  );
}
