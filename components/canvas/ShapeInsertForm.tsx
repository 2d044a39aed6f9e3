'use client';
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect } from 'react';
import { useForm, type Resolver } from 'react-hook-form';
import { shapeFormSchema, shapeFromForm, type Shape, type Span } from './model';

/** All fields of every shape at once, so switching kinds keeps what was typed. */
interface ShapeFields {
  kind: Shape['kind'];
  startS: number;
  endS: number;
  rateHz: number;
  fromHz: number;
  toHz: number;
  meanHz: number;
  depthHz: number;
  freqHz: number;
  phaseDeg: number;
}

const PARAMS: Record<Shape['kind'], [keyof ShapeFields, string][]> = {
  hold: [['rateHz', 'rate (Hz)']],
  ramp: [
    ['fromHz', 'from (Hz)'],
    ['toHz', 'to (Hz)'],
  ],
  sine: [
    ['meanHz', 'mean (Hz)'],
    ['depthHz', 'depth (Hz)'],
    ['freqHz', 'frequency (Hz)'],
    ['phaseDeg', 'phase (°)'],
  ],
};

const round6 = (x: number) => Number(x.toFixed(6));

const KIND_TEXT: Record<Shape['kind'], string> = {
  hold: 'Hold: one rate for the whole span.',
  ramp: 'Ramp: a straight line from one rate to another.',
  sine: 'Sine: mean + depth · sin(2π · frequency · t + phase), t from the span start. Stays an exact sine in the spec.',
};

export interface ShapeInsertFormProps {
  /** Span offered when the form first shows. */
  initialSpan: Span;
  /** Span between the selected points (two or more), offered whenever the selection changes; typed spans are otherwise left alone. */
  selectionSpan: Span | null;
  disabled?: boolean;
  onInsert: (shape: Shape, span: Span) => void;
}

/** Replaces a span of the envelope with one exact hold, ramp or sine segment. */
export function ShapeInsertForm({ initialSpan, selectionSpan, disabled, onInsert }: ShapeInsertFormProps) {
  const { register, handleSubmit, watch, setValue, formState } = useForm<ShapeFields>({
    resolver: zodResolver(shapeFormSchema) as unknown as Resolver<ShapeFields>,
    mode: 'onChange',
    defaultValues: { kind: 'hold', startS: round6(initialSpan.startS), endS: round6(initialSpan.endS), rateHz: 20, fromHz: 5, toHz: 40, meanHz: 20, depthHz: 10, freqHz: 1, phaseDeg: 0 },
  });
  const kind = watch('kind');
  const errors = formState.errors as Partial<Record<keyof ShapeFields, { message?: string }>>;

  const selStart = selectionSpan?.startS;
  const selEnd = selectionSpan?.endS;
  useEffect(() => {
    if (selStart === undefined || selEnd === undefined) return;
    setValue('startS', round6(selStart), { shouldValidate: true });
    setValue('endS', round6(selEnd), { shouldValidate: true });
  }, [selStart, selEnd, setValue]);

  const submit = handleSubmit((values) => {
    const parsed = shapeFormSchema.safeParse(values);
    if (!parsed.success) return;
    const { shape, span } = shapeFromForm(parsed.data);
    onInsert(shape, span);
  });

  const field = (name: keyof ShapeFields, label: string) => (
    <label key={name} className="block">
      <span className="label">{label}</span>
      <input type="number" step="any" inputMode="decimal" className="field font-mono" aria-invalid={errors[name] ? true : undefined} {...register(name, { valueAsNumber: true })} />
      {errors[name]?.message ? <span className="field-error block">{errors[name]!.message}</span> : null}
    </label>
  );

  return (
    <form onSubmit={submit} aria-label="Insert a shape" className="space-y-3">
      <fieldset className="flex flex-wrap gap-3" disabled={disabled}>
        <legend className="label">Shape</legend>
        {(['hold', 'ramp', 'sine'] as const).map((k) => (
          <label key={k} className="flex items-center gap-1.5 text-sm">
            <input type="radio" value={k} {...register('kind')} />
            {k}
          </label>
        ))}
      </fieldset>
      <p className="text-xs text-ink-muted">{KIND_TEXT[kind]}</p>
      <fieldset className="grid grid-cols-2 gap-2" disabled={disabled}>
        <legend className="sr-only">Span</legend>
        {field('startS', 'from (s)')}
        {field('endS', 'to (s)')}
      </fieldset>
      <fieldset className="grid grid-cols-2 gap-2" disabled={disabled}>
        <legend className="sr-only">Parameters</legend>
        {PARAMS[kind].map(([name, label]) => field(name, label))}
      </fieldset>
      <button type="submit" className="btn btn-primary" disabled={disabled}>
        Replace span with {kind}
      </button>
    </form>
  );
}
