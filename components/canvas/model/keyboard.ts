/**
 * Keys of the envelope editor, as plain data so the canvas, its help text and the tests
 * agree. Everything the pointer does has a key here.
 */
export type EditorAction =
  | { type: 'undo' }
  | { type: 'redo' }
  | { type: 'delete' }
  | { type: 'nudge'; direction: 'left' | 'right' | 'up' | 'down'; big: boolean }
  | { type: 'select-step'; by: -1 | 1; extend: boolean }
  | { type: 'select-all' }
  | { type: 'select-none' }
  | { type: 'add-after' }
  | { type: 'zoom'; factor: number }
  | { type: 'pan'; fraction: number }
  | { type: 'fit' };

export interface KeyLike {
  key: string;
  shiftKey: boolean;
  ctrlKey: boolean;
  metaKey: boolean;
  altKey: boolean;
}

export function keyAction(e: KeyLike): EditorAction | null {
  const mod = e.ctrlKey || e.metaKey;
  const key = e.key.length === 1 ? e.key.toLowerCase() : e.key;
  if (mod && key === 'z') return e.shiftKey ? { type: 'redo' } : { type: 'undo' };
  if (mod && key === 'y') return { type: 'redo' };
  if (mod && key === 'a') return { type: 'select-all' };
  if (mod || e.altKey) return null;
  switch (key) {
    case 'Delete':
    case 'Backspace':
      return { type: 'delete' };
    case 'ArrowLeft':
      return { type: 'nudge', direction: 'left', big: e.shiftKey };
    case 'ArrowRight':
      return { type: 'nudge', direction: 'right', big: e.shiftKey };
    case 'ArrowUp':
      return { type: 'nudge', direction: 'up', big: e.shiftKey };
    case 'ArrowDown':
      return { type: 'nudge', direction: 'down', big: e.shiftKey };
    case ',':
    case '<':
      return { type: 'select-step', by: -1, extend: e.shiftKey };
    case '.':
    case '>':
      return { type: 'select-step', by: 1, extend: e.shiftKey };
    case 'Escape':
      return { type: 'select-none' };
    case 'n':
      return { type: 'add-after' };
    case '+':
    case '=':
      return { type: 'zoom', factor: 1.5 };
    case '-':
    case '_':
      return { type: 'zoom', factor: 1 / 1.5 };
    case '[':
      return { type: 'pan', fraction: -0.25 };
    case ']':
      return { type: 'pan', fraction: 0.25 };
    case 'f':
    case '0':
      return { type: 'fit' };
    default:
      return null;
  }
}

/** Help lines shown under the canvas. */
export const KEY_HELP: readonly [string, string][] = [
  ['Click', 'add a breakpoint on a ramp'],
  ['Drag a point', 'move it (and the other selected points)'],
  ['Drag empty space', 'select the points in the box (Shift adds)'],
  ['Drag the time axis, Alt-drag, wheel', 'pan; zoom in time (Shift-wheel pans)'],
  [', / .', 'select previous / next point (Shift extends)'],
  ['Arrows', 'nudge one grid step (Shift: ten)'],
  ['N', 'add a point halfway to the next one'],
  ['Delete, Backspace', 'remove the selected points'],
  ['Ctrl/⌘ Z, Shift Ctrl/⌘ Z', 'undo, redo'],
  ['+ / −, [ / ], F', 'zoom, pan, fit'],
];
