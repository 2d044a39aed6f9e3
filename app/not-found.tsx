import Link from 'next/link';
import { Logo } from '@/components/ui/Logo';

export default function NotFound() {
  return (
    <main className="mx-auto max-w-md px-6 py-24 text-center">
      <Logo className="text-accent" />
      <h1 className="mt-6">Nothing here</h1>
      <p className="mt-2 text-sm text-ink-muted">The page does not exist, or it belongs to a lab you are not a member of.</p>
      <Link href="/" className="btn mt-6">Back to your lab</Link>
    </main>
  );
}
