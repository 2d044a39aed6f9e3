import { SignOutButton } from '@/components/ui/SignOutButton';

export default function NoLabPage() {
  return (
    <main className="mx-auto max-w-md px-6 py-24 text-center">
      <h1>You are not in a lab yet</h1>
      <p className="mt-2 text-sm text-ink-muted">Ask a lab admin to invite you; the invitation link adds you to the lab.</p>
      <div className="mt-6"><SignOutButton /></div>
    </main>
  );
}
