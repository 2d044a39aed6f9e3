import { STATUS_HELP, STATUS_LABELS, type VersionStatus } from '@/lib/versions/status';

// Shape as well as colour: a filled square for states that hold, an outlined one for states
// that wait or ended, so the badge reads without colour too.
const LOOK: Record<VersionStatus, { box: string; mark: string }> = {
  draft: { box: 'border-line bg-paper text-ink', mark: 'border border-ink-muted' },
  in_review: { box: 'border-warn/60 bg-warn-soft text-ink', mark: 'border-2 border-warn' },
  approved: { box: 'border-ok/60 bg-ok-soft text-ink', mark: 'bg-ok' },
  returned: { box: 'border-danger/50 bg-danger-soft text-ink', mark: 'bg-danger' },
  withdrawn: { box: 'border-line bg-panel text-ink-muted line-through decoration-ink-muted/50', mark: 'bg-line' },
};

export function StatusBadge({ status, withHelp = false }: { status: VersionStatus; withHelp?: boolean }) {
  const look = LOOK[status];
  return (
    <span className="inline-flex items-center gap-2">
      <span className={`inline-flex items-center gap-1.5 rounded border px-2 py-0.5 text-xs font-semibold ${look.box}`} data-testid="version-status">
        <span aria-hidden="true" className={`inline-block h-2 w-2 ${look.mark}`} />
        {STATUS_LABELS[status]}
      </span>
      {withHelp ? <span className="text-xs text-ink-muted">{STATUS_HELP[status]}</span> : null}
    </span>
  );
}
