'use client';
import dynamic from 'next/dynamic';
import type { CompareRastersProps } from './CompareRasters';

// Konva needs a browser canvas: the rasters load on the client only.
const CompareRasters = dynamic(() => import('./CompareRasters').then((m) => m.CompareRasters), {
  ssr: false,
  loading: () => <p className="text-sm text-ink-muted">Drawing the schedules…</p>,
});

export function CompareRastersLazy(props: CompareRastersProps) {
  return <CompareRasters {...props} />;
}
