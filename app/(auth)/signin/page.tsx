import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { Logo } from '@/components/ui/Logo';
import { auth } from '@/lib/auth/config';
import { EmailLinkForm, PasswordForm } from './SignInForms';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage({ searchParams }: PageProps<'/signin'>) {
  const params = await searchParams;
  const next = typeof params.callbackUrl === 'string' && params.callbackUrl.startsWith('/') ? params.callbackUrl : '/';
  if ((await auth())?.user) redirect(next);
  const error = typeof params.error === 'string' ? params.error : undefined;
  return (
    <main className="mx-auto grid min-h-screen max-w-4xl items-center gap-10 px-6 py-12 md:grid-cols-[1.1fr_1fr]">
      <section>
        <Logo className="text-lg text-accent" />
        <h1 className="mt-6">Random-timing stimulation, reviewed before it reaches an animal.</h1>
        <p className="mt-3 text-sm text-ink-muted">
          Draw a rate envelope, preview the seeded pulse schedule, send it to your lab&apos;s safety officer, and let the
          rig fetch exactly what was approved.
        </p>
      </section>
      <section className="card space-y-6">
        {error === 'AccessDenied' || error === 'Verification' ? (
          <p role="status" className="rounded-md bg-warn-soft px-3 py-2 text-sm">
            {error === 'Verification'
              ? 'That sign-in link has expired or was already used. Ask for a new one.'
              : 'If that address belongs to a Pulseloom account, a sign-in link is on its way.'}
          </p>
        ) : null}
        <div>
          <h2 className="mb-3 text-base">Sign in with a password</h2>
          <PasswordForm next={next} />
        </div>
        <div className="border-t border-line pt-5">
          <h2 className="mb-3 text-base">Or get a link by e-mail</h2>
          <EmailLinkForm next={next} />
        </div>
      </section>
    </main>
  );
}
