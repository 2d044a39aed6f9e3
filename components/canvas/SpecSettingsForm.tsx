'use client';
import { useEffect, useRef } from 'react';
import { useForm, type FieldErrors, type Resolver } from 'react-hook-form';
import { parseSpec, type Spec } from '@/lib/schedule/spec';
import { formToSettings, joinSpec, settingsFieldOf, settingsToForm, type SettingsForm, type SpecSettings } from './model';

export interface SpecSettingsFormProps {
  settings: SpecSettings;
  envelope: Spec['envelope'];
  readOnly?: boolean;
  /** Every change, valid or not: saving is blocked while invalid, editing never is. */
  onChange: (settings: SpecSettings) => void;
}

/**
 * Ceiling, refractory period, caps, pulse, trials and clock. Validation is the engine's
 * own spec schema (via parseSpec, so cross-field rules like "refractory ≥ pulse width"
 * apply here too), with each error placed on its field.
 */
export function SpecSettingsForm({ settings, envelope, readOnly, onChange }: SpecSettingsFormProps) {
  const ctx = useRef({ envelope, seed: settings.seed, onChange });
  ctx.current = { envelope, seed: settings.seed, onChange };

  const resolver: Resolver<SettingsForm> = async (values) => {
    const r = parseSpec(joinSpec(ctx.current.envelope, formToSettings(values, ctx.current.seed)));
    if (r.ok) return { values, errors: {} };
    const errors: FieldErrors<SettingsForm> = {};
    for (const e of r.errors) {
      const field = settingsFieldOf(e.path);
      if (field && !errors[field]) errors[field] = { type: 'spec', message: e.message };
    }
    return Object.keys(errors).length ? { values: {}, errors } : { values, errors: {} };
  };

  const { register, watch, formState, trigger, setValue } = useForm<SettingsForm>({ resolver, mode: 'onChange', defaultValues: settingsToForm(settings) });
  const errors = formState.errors;
  const unit = watch('unit');
  const useMaxRate = watch('useMaxRate');
  const useWindow = watch('useWindow');
  const phaseWidthUs = watch('phaseWidthUs');
  const phaseGapUs = watch('phaseGapUs');

  useEffect(() => {
    const sub = watch((values) => ctx.current.onChange(formToSettings(values as SettingsForm, ctx.current.seed)));
    void trigger();
    return () => sub.unsubscribe();
  }, [watch, trigger]);

  // Envelope edits can make a setting wrong (a ceiling below a new peak): re-check.
  useEffect(() => {
    void trigger();
  }, [envelope, trigger]);

  const num = (name: keyof SettingsForm, label: string, unitText?: string) => (
    <label className="block">
      <span className="label">
        {label}
        {unitText ? <span className="normal-case tracking-normal"> ({unitText})</span> : null}
      </span>
      <input type="number" step="any" inputMode="decimal" className="field font-mono" aria-invalid={errors[name] ? true : undefined} {...register(name, { valueAsNumber: true })} />
      {errors[name]?.message ? <span className="field-error block">{String(errors[name]!.message)}</span> : null}
    </label>
  );

  const biphasicMs = (2 * (phaseWidthUs || 0) + (phaseGapUs || 0)) / 1000;

  return (
    <form aria-label="Schedule settings" onSubmit={(e) => e.preventDefault()}>
      <fieldset disabled={readOnly} className="space-y-4">
        <div className="grid grid-cols-2 gap-3">
          {num('ceilingHz', 'Ceiling', 'Hz')}
          {num('trials', 'Trials')}
          {num('absoluteMs', 'Refractory', 'ms')}
          {num('recoveryMs', 'Recovery', 'ms')}
          {num('clockHz', 'Output clock', 'Hz')}
        </div>

        <fieldset className="space-y-2">
          <legend className="label">Caps</legend>
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" {...register('useMaxRate')} /> Limit the instantaneous rate
          </label>
          {useMaxRate ? num('maxRateHz', 'Rate cap', 'Hz') : null}
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" {...register('useWindow')} /> Limit pulses per sliding window
          </label>
          {useWindow ? (
            <div className="grid grid-cols-2 gap-3">
              {num('windowSeconds', 'Window', 's')}
              {num('windowMaxPulses', 'Most pulses')}
            </div>
          ) : null}
        </fieldset>

        <fieldset className="space-y-2">
          <legend className="label">Pulse</legend>
          <label className="block">
            <span className="label">Stimulus</span>
            <select className="field" {...register('unit')}>
              <option value="mW">light (mW)</option>
              <option value="uA">current (µA), biphasic</option>
            </select>
            {errors.unit?.message ? <span className="field-error block">{String(errors.unit.message)}</span> : null}
          </label>
          <div className="grid grid-cols-2 gap-3">
            {num('widthMs', 'Width', 'ms')}
            {num('amplitude', unit === 'uA' ? 'Current per phase' : 'Peak power', unit === 'uA' ? 'µA' : 'mW')}
          </div>
          {unit === 'uA' ? (
            <>
              <div className="grid grid-cols-2 gap-3">
                {num('phaseWidthUs', 'Phase width', 'µs')}
                {num('phaseGapUs', 'Gap between phases', 'µs')}
              </div>
              <label className="block">
                <span className="label">First phase</span>
                <select className="field" {...register('leading')}>
                  <option value="cathodic">cathodic</option>
                  <option value="anodic">anodic</option>
                </select>
              </label>
              <p className="text-xs text-ink-muted">
                Both phases and the gap last <span className="font-mono">{biphasicMs} ms</span>.{' '}
                <button type="button" className="underline" onClick={() => setValue('widthMs', biphasicMs, { shouldValidate: true, shouldDirty: true })}>
                  Use as width
                </button>
              </p>
            </>
          ) : null}
        </fieldset>
      </fieldset>
    </form>
  );
}
