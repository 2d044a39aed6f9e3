import { desc } from 'drizzle-orm';
import { notFound } from 'next/navigation';
import { db } from '@/db/client';
import { devMailbox } from '@/db/schema';
import { Logo } from '@/components/ui/Logo';
import { devMailboxEnabled } from '@/lib/env';

export const dynamic = 'force-dynamic';

/** Development-only view of what the local fake SMTP server received. */
export default async function DevMailboxPage() {
  if (!devMailboxEnabled()) notFound();
  const messages = await db.select().from(devMailbox).orderBy(desc(devMailbox.receivedAt)).limit(100);
  return (
    <main className="mx-auto max-w-4xl px-6 py-10">
      <Logo className="text-accent" />
      <h1 className="mt-4">Development mailbox</h1>
      <p className="mt-1 text-sm text-ink-muted">
        Everything Pulseloom sent to the local fake SMTP server, newest first. Off in production unless
        PULSELOOM_DEV_MAILBOX=1; with SMTP_URL set, mail goes to a real server instead.
      </p>
      {messages.length === 0 ? (
        <p className="card mt-6 text-sm text-ink-muted">No messages yet.</p>
      ) : (
        <ol className="mt-6 space-y-4">
          {messages.map((m) => (
            <li key={m.id} className="card" data-testid="mail">
              <div className="flex flex-wrap justify-between gap-2 text-xs text-ink-muted">
                <span>to <span data-testid="mail-to">{m.to}</span></span>
                <time dateTime={m.receivedAt.toISOString()}>{m.receivedAt.toISOString().replace('T', ' ').slice(0, 19)} UTC</time>
              </div>
              <p className="mt-1 font-semibold" data-testid="mail-subject">{m.subject}</p>
              <pre className="mt-2 whitespace-pre-wrap font-mono text-xs" data-testid="mail-text">{linkify(m.text)}</pre>
            </li>
          ))}
        </ol>
      )}
    </main>
  );
}

function linkify(text: string) {
  return text.split(/(https?:\/\/\S+)/g).map((part, i) =>
    /^https?:\/\//.test(part) ? <a key={i} href={part} className="text-accent underline">{part}</a> : part,
  );
}
