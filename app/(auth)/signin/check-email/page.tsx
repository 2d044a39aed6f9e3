export const dynamic = 'force-dynamic';

import Link from 'next/link';
import { devMailboxEnabled } from '@/lib/env';

export default function CheckEmailPage() {
  return (
    <main className="mx-auto max-w-md px-6 py-24 text-center">
      <h1>Check your e-mail</h1>
      <p className="mt-2 text-sm text-ink-muted">
        If that address belongs to a Pulseloom account, a sign-in link is on its way. It works once and expires in 24 hours.
      </p>
      {devMailboxEnabled() ? (
        <Link href="/dev/mailbox" className="btn mt-6">Open the development mailbox</Link>
      ) : null}
    </main>
  );
}
