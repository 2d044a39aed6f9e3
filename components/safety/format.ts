import type { Limit, RowStatus, SheetRow } from '@/lib/safety';

/** Four significant digits, no exponent for everyday magnitudes, a thin space before the unit. */
export function formatNumber(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return '0';
  const abs = Math.abs(x);
  if (abs >= 1e6 || abs < 1e-3) return x.toPrecision(3);
  return String(Number(x.toPrecision(4)));
}

export function withUnit(x: number, unit: string): string {
  return unit ? `${formatNumber(x)} ${unit}` : formatNumber(x);
}

export function formatLimit(row: Pick<SheetRow, 'limit' | 'direction' | 'unit'>): string {
  const limit: Limit | null = row.limit;
  if (!limit || (limit.hard === undefined && limit.warn === undefined)) return '—';
  const sign = row.direction === 'min' ? '≥' : '≤';
  const parts: string[] = [];
  if (limit.hard !== undefined) parts.push(`hard ${sign} ${withUnit(limit.hard, row.unit)}`);
  if (limit.warn !== undefined) parts.push(`warn ${sign} ${withUnit(limit.warn, row.unit)}`);
  return parts.join(' · ');
}

export function formatMargin(row: Pick<SheetRow, 'margin' | 'unit'>): string {
  if (row.margin === null) return '—';
  const sign = row.margin > 0 ? '+' : row.margin < 0 ? '−' : '';
  return `${sign}${withUnit(Math.abs(row.margin), row.unit)}`;
}

/**
 * Words first: the colour only repeats what the label and the mark already say, and the
 * label stays in ink so it reads at small sizes on the tinted ground.
 */
export const STATUS_LOOK: Record<RowStatus, { label: string; mark: string; badge: string; dot: string }> = {
  pass: { label: 'Within limit', mark: '✓', badge: 'border-ok/50 bg-ok-soft', dot: 'bg-ok text-white' },
  warn: { label: 'Needs justification', mark: '!', badge: 'border-warn/60 bg-warn-soft', dot: 'bg-warn text-white' },
  fail: { label: 'Beyond hard limit', mark: '✕', badge: 'border-danger/60 bg-danger-soft', dot: 'bg-danger text-white' },
  info: { label: 'For information', mark: 'i', badge: 'border-line bg-paper', dot: 'bg-ink-muted text-white' },
  'not-set': { label: 'No limit set', mark: '–', badge: 'border-dashed border-line bg-panel', dot: 'bg-line text-ink' },
};
