import { expect, type Locator, type Page } from '@playwright/test';

/**
 * Page helpers for the envelope editor tests: where a (time, rate) point is on the canvas,
 * and the segment table read back as numbers.
 */

/** Margins of the plot inside the canvas box (EnvelopeCanvas MARGIN) and the view that fits a new envelope (fitView). */
const PLOT = { left: 52, right: 14, top: 14, bottom: 38, height: 340 };

export interface View {
  t0: number;
  t1: number;
  hzTop: number;
}

/**
 * The view the editor opens with: the whole envelope plus 2 % before and after, rates up
 * to 110 % of the highest of envelope peak, ceiling and rate cap.
 */
export function openingView(durationS: number, topHz: number): View {
  return { t0: -0.02 * durationS, t1: 1.02 * durationS, hzTop: 1.1 * topHz };
}

export function canvas(page: Page): Locator {
  return page.getByRole('application', { name: /Envelope editor/ });
}

/** Page coordinates of (t, hz) on the canvas. */
export async function pointOnCanvas(page: Page, view: View, t: number, hz: number) {
  const el = canvas(page);
  // Pointer events go only where the viewport shows: bring the whole plot on screen first.
  await el.scrollIntoViewIfNeeded();
  const box = await el.boundingBox();
  const width = await el.evaluate((e) => e.clientWidth);
  if (!box) throw new Error('canvas not laid out');
  const plotW = width - PLOT.left - PLOT.right;
  const plotH = PLOT.height - PLOT.top - PLOT.bottom;
  return {
    x: box.x + PLOT.left + ((t - view.t0) / (view.t1 - view.t0)) * plotW,
    y: box.y + PLOT.top + plotH - (hz / view.hzTop) * plotH,
  };
}

export interface Row {
  kind: 'ramp' | 'sine';
  durationS: number;
  fromHz?: number;
  toHz?: number;
  meanHz?: number;
  depthHz?: number;
  freqHz?: number;
  phaseDeg?: number;
}

const num = async (page: Page, label: string) => Number(await page.getByLabel(label, { exact: true }).inputValue());

/** The segment table's first page, as numbers. */
export async function readTable(page: Page): Promise<Row[]> {
  const n = await page.getByRole('combobox', { name: /^Segment \d+ kind$/ }).count();
  const rows: Row[] = [];
  for (let i = 1; i <= n; i++) {
    const kind = (await page.getByLabel(`Segment ${i} kind`, { exact: true }).inputValue()) as Row['kind'];
    const durationS = await num(page, `Segment ${i} duration (s)`);
    if (kind === 'ramp') {
      rows.push({ kind, durationS, fromHz: await num(page, `Segment ${i} from (Hz)`), toHz: await num(page, `Segment ${i} to (Hz)`) });
    } else {
      rows.push({
        kind,
        durationS,
        meanHz: await num(page, `Segment ${i} mean (Hz)`),
        depthHz: await num(page, `Segment ${i} depth (Hz)`),
        freqHz: await num(page, `Segment ${i} frequency (Hz)`),
        phaseDeg: await num(page, `Segment ${i} phase (°)`),
      });
    }
  }
  return rows;
}

/**
 * Pulses one trial expects: the integral of the rate envelope, in closed form — trapezoids
 * for ramps, and for mean + depth·sin(2πft + φ) over D seconds
 * mean·D + depth/(2πf)·(cos φ − cos(2πfD + φ)) (elementary calculus).
 */
export function expectedPulses(rows: readonly Row[]): number {
  let sum = 0;
  for (const r of rows) {
    if (r.kind === 'ramp') sum += (r.durationS * (r.fromHz! + r.toHz!)) / 2;
    else {
      const w = 2 * Math.PI * r.freqHz!;
      const phi = (r.phaseDeg! * Math.PI) / 180;
      sum += r.meanHz! * r.durationS + (r.depthHz! / w) * (Math.cos(phi) - Math.cos(w * r.durationS + phi));
    }
  }
  return sum;
}

/** The preview panel once it shows the current spec. */
export async function previewSettled(page: Page): Promise<Locator> {
  const preview = page.getByRole('region', { name: 'Preview', exact: true });
  await expect(preview).toHaveAttribute('aria-busy', 'false', { timeout: 20_000 });
  await expect(preview.getByText('Up to date')).toBeVisible();
  return preview;
}

/** The value cell beside a label in the preview numbers. */
export function previewNumber(page: Page, label: string): Locator {
  return page
    .getByRole('region', { name: 'Preview numbers' })
    .locator('dt', { hasText: label })
    .locator('xpath=following-sibling::dd[1]');
}
