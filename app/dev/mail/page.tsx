import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { devMailEnabled } from '@/lib/config';
import { listMessages } from '@/lib/mail/mailbox';
import { LogoMark } from '@/components/shell/logo-mark';
import { EmptyState } from '@/components/ui/empty-state';
import { Badge } from '@/components/ui/badge';
import { LinkedText } from '@/components/ui/linked-text';

export const metadata: Metadata = { title: 'Development mailbox' };
export const dynamic = 'force-dynamic';

export default async function DevMailPage() {
  if (!devMailEnabled()) notFound();
  const messages = await listMessages();

  return (
    <div className="min-h-screen">
      <header className="border-b border-paper-300 bg-paper-100">
        <div className="mx-auto flex max-w-4xl items-center gap-3 px-4 py-3 sm:px-6">
          <LogoMark className="h-6 w-6" />
          <span className="font-semibold">Branchwise</span>
          <Badge tone="warn" shape="bang">
            development only
          </Badge>
        </div>
      </header>
      <main id="main" className="mx-auto max-w-4xl space-y-4 px-4 py-6 sm:px-6">
        <div>
          <h1 className="text-xl font-semibold tracking-tight">Development mailbox</h1>
          <p className="text-paper-600">
            Every e-mail the app sent through the local SMTP stand-in, newest first. Nothing here leaves this machine.
          </p>
        </div>
        {messages.length === 0 ? (
          <div className="rounded-lg border border-paper-300 bg-paper-0">
            <EmptyState title="No mail yet" data-testid="mail-empty">
              Ask for a sign-in link or send an invitation; the message appears here.
            </EmptyState>
          </div>
        ) : (
          <ol className="space-y-3" aria-label="Messages">
            {messages.map((m) => (
              <li key={m.id} data-testid="mail-message">
                <article className="rounded-lg border border-paper-300 bg-paper-0 shadow-panel" aria-labelledby={`m-${m.id}`}>
                  <header className="border-b border-paper-200 px-4 py-2.5">
                    <h2 id={`m-${m.id}`} className="font-semibold text-paper-900">
                      {m.subject || '(no subject)'}
                    </h2>
                    <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-xs text-paper-700">
                      <dt className="font-semibold">To</dt>
                      <dd data-testid="mail-to">{m.to.join(', ')}</dd>
                      <dt className="font-semibold">From</dt>
                      <dd>{m.from}</dd>
                      <dt className="font-semibold">Date</dt>
                      <dd>
                        <time dateTime={m.date}>{formatDate(m.date)}</time>
                      </dd>
                    </dl>
                  </header>
                  <div className="whitespace-pre-wrap break-words px-4 py-3 font-mono text-xs leading-5 text-paper-800">
                    <LinkedText text={m.text} />
                  </div>
                </article>
              </li>
            ))}
          </ol>
        )}
      </main>
    </div>
  );
}

function formatDate(iso: string): string {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : d.toISOString().replace('T', ' ').slice(0, 19) + ' UTC';
}
