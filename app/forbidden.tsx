import Link from 'next/link';

export default function Forbidden() {
  return (
    <main className="mx-auto max-w-md px-6 py-24 text-center">
      <p className="font-mono text-sm text-danger">403</p>
      <h1 className="mt-2">Not for your role</h1>
      <p className="mt-2 text-sm text-ink-muted">
        Your role in this lab does not open this page. A lab admin can change roles on the Members page.
      </p>
      <Link href="/" className="btn mt-6">Back to your lab</Link>
    </main>
  );
}
