'use client';
import type { DocIssue } from './model';

/**
 * Every envelope problem in words, each with a button that selects where it is. The
 * canvas shows the same problems as markers; this list is the one a screen reader and a
 * crowded view can rely on.
 */
export function IssueList({ issues, onShow }: { issues: readonly DocIssue[]; onShow: (issue: DocIssue) => void }) {
  if (issues.length === 0) return null;
  return (
    <div className="mt-2 rounded-md border border-danger bg-danger-soft p-2 text-sm" role="region" aria-label="Problems in the envelope">
      <p className="font-semibold text-danger">
        {issues.length} problem{issues.length > 1 ? 's' : ''} in the envelope (saving is blocked until they are fixed):
      </p>
      <ul className="mt-1 space-y-0.5">
        {issues.slice(0, 12).map((i, n) => (
          <li key={n} className="flex flex-wrap items-baseline gap-2">
            <span className="font-mono text-xs text-ink-muted">{i.path}</span>
            <span>{i.message}</span>
            {i.at.kind !== 'envelope' ? (
              <button type="button" className="text-xs text-accent underline" onClick={() => onShow(i)}>
                Show
              </button>
            ) : null}
          </li>
        ))}
        {issues.length > 12 ? <li className="text-ink-muted">… and {issues.length - 12} more.</li> : null}
      </ul>
    </div>
  );
}

