'use client';
import { useId } from 'react';
import { newSeed } from './model';

/** The seed decides every pulse time: always shown, typed freely, or drawn anew. */
export function SeedControls({ seed, readOnly, onChange }: { seed: string; readOnly?: boolean; onChange: (seed: string) => void }) {
  const id = useId();
  const empty = seed.trim() === '';
  return (
    <div className="flex flex-wrap items-end gap-2">
      <label htmlFor={id} className="block grow">
        <span className="label">Seed</span>
        <input
          id={id}
          className="field font-mono"
          value={seed}
          maxLength={256}
          readOnly={readOnly}
          aria-invalid={empty || undefined}
          onChange={(e) => onChange(e.target.value)}
          spellCheck={false}
          autoComplete="off"
        />
      </label>
      <button type="button" className="btn" disabled={readOnly} onClick={() => onChange(newSeed())}>
        New seed
      </button>
      {empty ? <p className="field-error w-full">A seed is needed: type one or draw a new one.</p> : null}
    </div>
  );
}
