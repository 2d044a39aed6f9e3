import { lazy, Suspense, type ComponentType, type ReactNode } from 'react';

/**
 * Stands in for next/dynamic in the benchmark page only (no Next.js runtime there):
 * the same deferred load, through React.lazy.
 */
export default function dynamic<P extends object>(load: () => Promise<ComponentType<P>>, options?: { loading?: () => ReactNode }) {
  const Lazy = lazy(async () => ({ default: await load() }));
  return function Dynamic(props: P) {
    return (
      <Suspense fallback={options?.loading?.() ?? null}>
        <Lazy {...props} />
      </Suspense>
    );
  };
}
