import { describe, expect, it } from 'vitest';
import { keyAction, KEY_HELP } from '@/components/canvas/model';

const k = (key: string, mods: Partial<{ shiftKey: boolean; ctrlKey: boolean; metaKey: boolean; altKey: boolean }> = {}) => ({
  key,
  shiftKey: false,
  ctrlKey: false,
  metaKey: false,
  altKey: false,
  ...mods,
});

describe('keyAction', () => {
  it('undo and redo with Ctrl or Cmd', () => {
    expect(keyAction(k('z', { ctrlKey: true }))).toEqual({ type: 'undo' });
    expect(keyAction(k('z', { metaKey: true }))).toEqual({ type: 'undo' });
    expect(keyAction(k('Z', { metaKey: true, shiftKey: true }))).toEqual({ type: 'redo' });
    expect(keyAction(k('y', { ctrlKey: true }))).toEqual({ type: 'redo' });
  });

  it('Delete and Backspace remove the selection', () => {
    expect(keyAction(k('Delete'))).toEqual({ type: 'delete' });
    expect(keyAction(k('Backspace'))).toEqual({ type: 'delete' });
  });

  it('arrows nudge, Shift for the big step', () => {
    expect(keyAction(k('ArrowLeft'))).toEqual({ type: 'nudge', direction: 'left', big: false });
    expect(keyAction(k('ArrowUp', { shiftKey: true }))).toEqual({ type: 'nudge', direction: 'up', big: true });
  });

  it('has keys for selection, adding, zoom, pan and fit', () => {
    expect(keyAction(k('.'))).toEqual({ type: 'select-step', by: 1, extend: false });
    expect(keyAction(k('<', { shiftKey: true }))).toEqual({ type: 'select-step', by: -1, extend: true });
    expect(keyAction(k('a', { ctrlKey: true }))).toEqual({ type: 'select-all' });
    expect(keyAction(k('Escape'))).toEqual({ type: 'select-none' });
    expect(keyAction(k('N', { shiftKey: true }))).toEqual({ type: 'add-after' });
    expect(keyAction(k('+'))).toMatchObject({ type: 'zoom' });
    expect(keyAction(k('['))).toEqual({ type: 'pan', fraction: -0.25 });
    expect(keyAction(k('f'))).toEqual({ type: 'fit' });
  });

  it('leaves other keys and browser shortcuts alone', () => {
    expect(keyAction(k('Tab'))).toBeNull();
    expect(keyAction(k('r', { ctrlKey: true }))).toBeNull();
    expect(keyAction(k('ArrowLeft', { altKey: true }))).toBeNull();
  });

  it('the help lists a key for every pointer action', () => {
    expect(KEY_HELP.length).toBeGreaterThanOrEqual(8);
  });
});
