// What changed between two JSON-like records, as `path: before → after` lines, so an
// audit entry for an edit says at a glance which numbers moved. Keys are visited in
// sorted order so the same edit always reads the same way.

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };

const isRecord = (x: unknown): x is Record<string, unknown> => typeof x === 'object' && x !== null && !Array.isArray(x);

function show(x: unknown): string {
  return x === undefined ? '(not set)' : JSON.stringify(x);
}

export function describeChanges(before: unknown, after: unknown, path = ''): string[] {
  if (isRecord(before) && isRecord(after)) {
    const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])].sort();
    return keys.flatMap((k) => describeChanges(before[k], after[k], path ? `${path}.${k}` : k));
  }
  if (JSON.stringify(before) === JSON.stringify(after)) return [];
  return [`${path || '(root)'}: ${show(before)} → ${show(after)}`];
}

export type { Json };
