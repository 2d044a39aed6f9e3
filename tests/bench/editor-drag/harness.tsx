import { createRoot } from 'react-dom/client';
import { EnvelopeWorkbench } from '@/components/canvas/EnvelopeWorkbench';
import '@/app/globals.css';
import { dragBenchSpec } from './spec';

/**
 * The benchmark page: the real workbench on a 5,000-breakpoint envelope, laid out like
 * the envelope page (same width), with a recorder of animation-frame times.
 */
declare global {
  interface Window {
    frameLog: { recording: boolean; times: number[] };
  }
}

window.frameLog = { recording: false, times: [] };
const tick = (t: number) => {
  if (window.frameLog.recording) window.frameLog.times.push(t);
  requestAnimationFrame(tick);
};
requestAnimationFrame(tick);

createRoot(document.getElementById('root')!).render(
  <main className="mx-auto max-w-7xl px-6 py-8">
    <EnvelopeWorkbench initialSpec={dragBenchSpec()} onSave={async () => ({ ok: true })} downloadName="bench" />
  </main>,
);
