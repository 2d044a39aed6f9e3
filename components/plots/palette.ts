/**
 * Drawing colours for Konva, matching the Tailwind tokens (tailwind.config.ts): canvas
 * pixels cannot read CSS classes, so the hex values live here once.
 */
export const palette = {
  ink: '#1d2430',
  inkMuted: '#5b6472',
  paper: '#f6f4ef',
  panel: '#ffffff',
  line: '#d9d4c7',
  accent: '#0f6e6a',
  warn: '#b7791f',
  danger: '#b33a3a',
  ok: '#2f7d4f',
  /** The drawn envelope. */
  envelope: '#0f6e6a',
  /** Rate estimated from generated pulses. */
  estimate: '#7a4fb3',
  /** Faint grid lines. */
  grid: '#ece8de',
} as const;

const FALLBACK = { sans: 'system-ui, sans-serif', mono: 'ui-monospace, monospace' } as const;
const resolved: Partial<Record<'sans' | 'mono', string>> = {};

/**
 * The page's font families for canvas text. The layout loads them under generated
 * names exposed as --font-sans / --font-mono; canvas cannot read CSS variables, so
 * they are looked up once in the browser.
 */
export function canvasFont(kind: 'sans' | 'mono', sizePx: number, weight = 400): string {
  if (resolved[kind] === undefined && typeof document !== 'undefined') {
    const v = getComputedStyle(document.documentElement).getPropertyValue(`--font-${kind}`).trim();
    resolved[kind] = v ? `${v}, ${FALLBACK[kind]}` : FALLBACK[kind];
  }
  return `${weight} ${sizePx}px ${resolved[kind] ?? FALLBACK[kind]}`;
}
