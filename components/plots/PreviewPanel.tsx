'use client';
import { memo } from 'react';
import type { SpecError } from '@/lib/schedule/spec';
import type { PreviewResponse } from '@/lib/preview/types';
import { CountsPerTrial } from './CountsPerTrial';
import { IntervalHistogram } from './IntervalHistogram';
import { PreviewSummary } from './PreviewSummary';
import { Raster } from './Raster';
import { RateVsEnvelope } from './RateVsEnvelope';

export interface PreviewPanelProps {
  data: PreviewResponse | undefined;
  loading: boolean;
  /** What is on screen belongs to an earlier version of the spec. */
  stale: boolean;
  /** The spec is invalid: no request is made. */
  blocked: boolean;
  error: { message: string; errors?: SpecError[] } | null;
  seed: string;
  trials: number;
  maxTrials: number;
  onTrialsChange: (n: number) => void;
}

/**
 * The live preview: a few trials from the engine with the seed in use, as plots and numbers.
 * Memoized: selecting a point re-renders the workbench, and redrawing a raster of thousands
 * of pulses for that would stall the press by tens of milliseconds.
 */
export const PreviewPanel = memo(function PreviewPanel(p: PreviewPanelProps) {
  const { data } = p;
  return (
    <section aria-label="Preview" aria-busy={p.loading}>
      <header className="mb-3 flex flex-wrap items-center gap-x-4 gap-y-2">
        <h2>Preview</h2>
        <p className="text-sm text-ink-muted">
          Seed <span className="font-mono text-ink">{p.seed || '—'}</span>
        </p>
        <label className="flex items-center gap-1.5 text-sm text-ink-muted">
          Trials
          <input
            type="number"
            min={1}
            max={p.maxTrials}
            className="field w-16 px-1 py-0.5 font-mono"
            value={p.trials}
            onChange={(e) => {
              const n = Math.round(Number(e.target.value));
              if (n >= 1 && n <= p.maxTrials) p.onTrialsChange(n);
            }}
          />
        </label>
        <p className="text-sm" role="status" aria-live="polite">
          {p.blocked ? (
            <span className="text-warn">Paused until the spec is valid.</span>
          ) : p.loading ? (
            <span className="inline-flex items-center gap-1.5 text-accent">
              <span className="inline-block h-2.5 w-2.5 animate-pulse rounded-full bg-accent" aria-hidden />
              Updating…
            </span>
          ) : p.error ? null : data ? (
            <span className="text-ok">Up to date</span>
          ) : null}
        </p>
      </header>

      {p.error ? (
        <div className="mb-3 rounded-md border border-danger bg-danger-soft p-2 text-sm" role="alert">
          <p>{p.error.message}</p>
          {p.error.errors?.length ? (
            <ul className="mt-1 font-mono text-xs">
              {p.error.errors.map((e) => (
                <li key={`${e.path}:${e.message}`}>
                  {e.path}: {e.message}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}

      {data ? (
        <div className={p.stale ? 'opacity-60 transition-opacity' : 'transition-opacity'}>
          {data.truncated ? (
            <p className="mb-2 rounded-md border border-warn bg-warn-soft p-2 text-sm">
              Showing the first <span className="font-mono">{data.coveredS} s</span> of <span className="font-mono">{data.durationS.toFixed(1)} s</span> so the preview stays quick; these are the
              same pulses the full schedule starts with.
            </p>
          ) : null}
          <div className="grid gap-5 lg:grid-cols-2">
            <Raster onsetsS={data.onsetsS} coveredS={data.coveredS} />
            <RateVsEnvelope preview={data} />
            <IntervalHistogram intervals={data.intervals} />
            <CountsPerTrial counts={data.counts} />
          </div>
          <div className="mt-5">
            <PreviewSummary summary={data.summary} trials={data.trials} />
          </div>
        </div>
      ) : !p.blocked && !p.error ? (
        <p className="text-sm text-ink-muted">Generating the first preview…</p>
      ) : null}
    </section>
  );
});
