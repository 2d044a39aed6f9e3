import { z } from 'zod';
import type { Shape, Span } from './shapes';

const num = (what: string) => z.number({ error: `${what} must be a number` }).refine(Number.isFinite, { error: `${what} must be a number` });
const rate = (what: string) => num(what).min(0, { error: `${what} must be ≥ 0` });

const span = { startS: num('start').min(0, { error: 'start must be ≥ 0' }), endS: num('end') };

/** Form values of the shape tool; the same zod rules as the engine's segment fields. */
export const shapeFormSchema = z
  .discriminatedUnion('kind', [
    z.object({ kind: z.literal('hold'), ...span, rateHz: rate('rate') }),
    z.object({ kind: z.literal('ramp'), ...span, fromHz: rate('from'), toHz: rate('to') }),
    z.object({
      kind: z.literal('sine'),
      ...span,
      meanHz: rate('mean'),
      depthHz: rate('depth'),
      freqHz: num('frequency').gt(0, { error: 'frequency must be > 0' }),
      phaseDeg: num('phase'),
    }),
  ])
  .refine((v) => v.endS > v.startS, { error: 'end must be after start', path: ['endS'] });

export type ShapeFormValues = z.infer<typeof shapeFormSchema>;

export function shapeFromForm(v: ShapeFormValues): { shape: Shape; span: Span } {
  const s: Span = { startS: v.startS, endS: v.endS };
  switch (v.kind) {
    case 'hold':
      return { shape: { kind: 'hold', rateHz: v.rateHz }, span: s };
    case 'ramp':
      return { shape: { kind: 'ramp', fromHz: v.fromHz, toHz: v.toHz }, span: s };
    case 'sine':
      return { shape: { kind: 'sine', meanHz: v.meanHz, depthHz: v.depthHz, freqHz: v.freqHz, phaseDeg: v.phaseDeg }, span: s };
  }
}
