/**
 * Parameter differences between two versions: every leaf of the spec (and any extra
 * fields such as the rig) that differs, as one row with its path, before and after.
 */
type Json = null | boolean | number | string | Json[] | { [k: string]: Json };

export type DiffRow = {
  /** Path in the spec, e.g. `envelope[1].toHz`, or an extra field's name. */
  path: string;
  before: string | null;
  after: string | null;
  change: 'changed' | 'added' | 'removed';
};

/** Leaves of a JSON value keyed by path; arrays by index, objects by key. */
export function flatten(value: unknown, prefix = ''): Map<string, string> {
  const out = new Map<string, string>();
  const walk = (v: unknown, path: string) => {
    if (Array.isArray(v)) {
      if (v.length === 0) out.set(path, '[]');
      v.forEach((x, i) => walk(x, `${path}[${i}]`));
    } else if (v !== null && typeof v === 'object') {
      const keys = Object.keys(v as Record<string, Json>).sort();
      if (keys.length === 0) out.set(path, '{}');
      for (const k of keys) walk((v as Record<string, unknown>)[k], path ? `${path}.${k}` : k);
    } else if (v !== undefined) {
      out.set(path || '(root)', formatLeaf(v));
    }
  };
  walk(value, prefix);
  return out;
}

function formatLeaf(v: unknown): string {
  if (typeof v === 'string') return v;
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : 'not a number';
  return String(v);
}

/** Order rows as they appear in a spec: envelope segments by index, then the rest. */
function comparePaths(a: string, b: string): number {
  const split = (p: string) => p.split(/[.[\]]+/).filter(Boolean);
  const pa = split(a);
  const pb = split(b);
  for (let i = 0; i < Math.min(pa.length, pb.length); i++) {
    const x = pa[i]!;
    const y = pb[i]!;
    if (x === y) continue;
    const nx = Number(x);
    const ny = Number(y);
    if (Number.isInteger(nx) && Number.isInteger(ny)) return nx - ny;
    return x < y ? -1 : 1;
  }
  return pa.length - pb.length;
}

export function diffValues(before: unknown, after: unknown): DiffRow[] {
  const a = flatten(before);
  const b = flatten(after);
  const rows: DiffRow[] = [];
  for (const path of new Set([...a.keys(), ...b.keys()])) {
    const x = a.get(path) ?? null;
    const y = b.get(path) ?? null;
    if (x === y) continue;
    rows.push({ path, before: x, after: y, change: x === null ? 'added' : y === null ? 'removed' : 'changed' });
  }
  return rows.sort((r, s) => comparePaths(r.path, s.path));
}

/**
 * Spec differences plus named extras (the rig, which lives beside the spec): extras first,
 * since a different rig changes what every other number means.
 */
export function diffVersions(
  before: { spec: unknown; extras?: Record<string, string | null> },
  after: { spec: unknown; extras?: Record<string, string | null> },
): DiffRow[] {
  const extras: DiffRow[] = [];
  const names = new Set([...Object.keys(before.extras ?? {}), ...Object.keys(after.extras ?? {})]);
  for (const name of names) {
    const x = before.extras?.[name] ?? null;
    const y = after.extras?.[name] ?? null;
    if (x !== y) extras.push({ path: name, before: x, after: y, change: x === null ? 'added' : y === null ? 'removed' : 'changed' });
  }
  return [...extras, ...diffValues(before.spec, after.spec)];
}
