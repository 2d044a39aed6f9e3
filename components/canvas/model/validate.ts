import { SPEC_FORMAT, parseSpec, type Spec, type SpecError } from '@/lib/schedule/spec';
import { boundaries, type EditorDoc } from './doc';
import { knotsAt } from './knots';

/** Where a problem is drawn: on a knot, over a segment, or on the envelope as a whole. */
export type IssueLocation =
  | { kind: 'point'; key: string; t: number; hz: number }
  | { kind: 'segment'; index: number; t0: number; t1: number }
  | { kind: 'envelope' };

export interface DocIssue {
  /** Spec path as the engine reports it, e.g. `envelope[3].toHz`. */
  path: string;
  message: string;
  at: IssueLocation;
}

export interface ValidateContext {
  ceilingHz: number;
  maxRateHz?: number;
}

/**
 * Runs the engine's own spec validation on the envelope, so the editor's verdict and the
 * server's can never differ, then places each problem where it can be drawn. The other
 * spec fields are filled with neutral valid values and their problems dropped: they are
 * the settings form's business. Problems block saving, never editing.
 */
export function validateDoc(doc: EditorDoc, ctx: ValidateContext): DocIssue[] {
  const probe: Spec = {
    format: SPEC_FORMAT,
    envelope: doc.segments as Spec['envelope'],
    ceilingHz: ctx.ceilingHz,
    refractory: { absoluteMs: 1, recoveryMs: 0 },
    caps: ctx.maxRateHz === undefined ? undefined : { maxRateHz: ctx.maxRateHz },
    pulse: { widthMs: 1, amplitude: 0, unit: 'mW' },
    trials: 1,
    seed: 'probe',
    clockHz: 10_000,
  };
  const result = parseSpec(probe);
  return result.ok ? [] : locateIssues(doc, result.errors, ctx);
}

/**
 * Places spec errors (from parseSpec of the whole spec, or of the probe above) on the
 * doc. Only envelope paths are kept. Lets the workbench validate once for saving and
 * for the markers.
 */
export function locateIssues(doc: EditorDoc, errors: readonly SpecError[], ctx: ValidateContext): DocIssue[] {
  const starts = boundaries(doc.segments);
  const issues: DocIssue[] = [];
  const seen = new Set<string>();
  const push = (issue: DocIssue) => {
    const id = `${issue.path}|${issue.message}|${issue.at.kind === 'point' ? issue.at.key : ''}`;
    if (!seen.has(id)) {
      seen.add(id);
      issues.push(issue);
    }
  };

  for (const err of errors) {
    if (err.path !== 'envelope' && !err.path.startsWith('envelope[')) continue;
    const m = /^envelope\[(\d+)\](?:\.(\w+))?/.exec(err.path);
    if (!m) {
      push({ ...err, at: { kind: 'envelope' } });
      continue;
    }
    const index = Number(m[1]);
    const field = m[2];
    const seg = doc.segments[index];
    const segmentAt: IssueLocation = { kind: 'segment', index, t0: starts[index] ?? 0, t1: starts[index + 1] ?? starts[index] ?? 0 };
    if (seg?.kind !== 'ramp' || (field !== 'fromHz' && field !== 'toHz')) {
      push({ ...err, at: segmentAt });
      continue;
    }
    // A rate problem on a ramp end belongs on that end's knot. The engine names one end
    // (the higher); when both ends break the same limit, both get a marker.
    const limit = /above ceilingHz/.test(err.message) ? ctx.ceilingHz : /above caps\.maxRateHz/.test(err.message) ? ctx.maxRateHz : undefined;
    const named: 'fromHz' | 'toHz' = field;
    const over = limit === undefined ? [] : (['fromHz', 'toHz'] as const).filter((f) => seg[f] > limit);
    for (const end of over.length ? over : [named]) {
      const b = end === 'fromHz' ? index : index + 1;
      const knot = knotsAt(doc.segments, b, starts[b]).find((k) => (end === 'fromHz' ? k.side !== 'in' : k.side !== 'out'));
      const message = limit === undefined || end === named ? err.message : `rate ${seg[end]} Hz, ${err.message.replace(/^rate reaches [\d.]+ Hz, /, '')}`;
      push({ path: `envelope[${index}].${end}`, message, at: knot ? { kind: 'point', key: knot.key, t: knot.t, hz: knot.hz } : segmentAt });
    }
  }
  return issues;
}

/** Issues grouped by knot key, for drawing markers without a search per knot. */
export function issuesByKnot(issues: readonly DocIssue[]): Map<string, DocIssue[]> {
  const map = new Map<string, DocIssue[]>();
  for (const issue of issues) {
    if (issue.at.kind !== 'point') continue;
    const list = map.get(issue.at.key) ?? [];
    list.push(issue);
    map.set(issue.at.key, list);
  }
  return map;
}
