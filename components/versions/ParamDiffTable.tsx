import type { DiffRow } from '@/lib/versions/diff';

const CHANGE_WORDS: Record<DiffRow['change'], string> = { changed: 'changed', added: 'added', removed: 'removed' };

/** Parameter differences between two versions, one row per changed value. */
export function ParamDiffTable({ rows, before, after }: { rows: DiffRow[]; before: string; after: string }) {
  if (rows.length === 0) {
    return <p className="text-sm text-ink-muted" data-testid="diff-empty">{after} has the same parameters as {before}.</p>;
  }
  return (
    <div className="overflow-x-auto rounded-card border border-line bg-panel">
      <table className="table" data-testid="param-diff">
        <caption className="sr-only">Parameters that differ between {before} and {after}</caption>
        <thead>
          <tr>
            <th scope="col">Parameter</th>
            <th scope="col">{before}</th>
            <th scope="col">{after}</th>
            <th scope="col">Change</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.path}>
              <th scope="row" className="font-mono text-xs font-normal normal-case tracking-normal text-ink">{r.path}</th>
              <td className="font-mono text-xs">{r.before ?? <span className="text-ink-muted">—</span>}</td>
              <td className="font-mono text-xs font-semibold">{r.after ?? <span className="text-ink-muted">—</span>}</td>
              <td className="text-xs text-ink-muted">{CHANGE_WORDS[r.change]}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
