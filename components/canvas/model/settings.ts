import { SPEC_FORMAT, parseSpec, type Spec, type SpecError } from '@/lib/schedule/spec';

/** Everything in a spec except its envelope: the small settings form beside the editor. */
export type SpecSettings = Omit<Spec, 'format' | 'envelope'>;

export function splitSpec(spec: Spec): { envelope: Spec['envelope']; settings: SpecSettings } {
  const { format: _format, envelope, ...settings } = spec;
  return { envelope, settings };
}

export function joinSpec(envelope: Spec['envelope'], settings: SpecSettings): Spec {
  return { format: SPEC_FORMAT, envelope, ...settings };
}

/** Reasons saving is blocked right now; empty when the spec is valid. */
export function saveBlockers(spec: Spec): SpecError[] {
  const r = parseSpec(spec);
  return r.ok ? [] : r.errors;
}

/**
 * A fresh seed: 'seed-' and 10 base-36 characters from the platform's cryptographic
 * source (about 51 bits, plenty to tell sessions apart; the seed is a label, not a secret).
 */
export function newSeed(randomValues: (a: Uint32Array) => Uint32Array = (a) => globalThis.crypto.getRandomValues(a)): string {
  const words = randomValues(new Uint32Array(2));
  const text = (words[0].toString(36) + words[1].toString(36)).padStart(10, '0').slice(-10);
  return `seed-${text}`;
}

/**
 * The settings form's flat values. Optional spec parts (caps, phases) get a switch and
 * keep their numbers while switched off, so toggling does not lose what was typed.
 */
export interface SettingsForm {
  ceilingHz: number;
  absoluteMs: number;
  recoveryMs: number;
  useMaxRate: boolean;
  maxRateHz: number;
  useWindow: boolean;
  windowSeconds: number;
  windowMaxPulses: number;
  unit: 'mW' | 'uA';
  widthMs: number;
  amplitude: number;
  phaseWidthUs: number;
  phaseGapUs: number;
  leading: 'cathodic' | 'anodic';
  trials: number;
  clockHz: number;
}

export function settingsToForm(s: SpecSettings): SettingsForm {
  return {
    ceilingHz: s.ceilingHz,
    absoluteMs: s.refractory.absoluteMs,
    recoveryMs: s.refractory.recoveryMs,
    useMaxRate: s.caps?.maxRateHz !== undefined,
    maxRateHz: s.caps?.maxRateHz ?? Math.min(s.ceilingHz, 50),
    useWindow: s.caps?.window !== undefined,
    windowSeconds: s.caps?.window?.seconds ?? 1,
    windowMaxPulses: s.caps?.window?.maxPulses ?? 20,
    unit: s.pulse.unit,
    widthMs: s.pulse.widthMs,
    amplitude: s.pulse.amplitude,
    phaseWidthUs: s.pulse.phases?.widthUs ?? 200,
    phaseGapUs: s.pulse.phases?.gapUs ?? 50,
    leading: s.pulse.phases?.leading ?? 'cathodic',
    trials: s.trials,
    clockHz: s.clockHz,
  };
}

export function formToSettings(f: SettingsForm, seed: string): SpecSettings {
  const caps: NonNullable<SpecSettings['caps']> = {};
  if (f.useMaxRate) caps.maxRateHz = f.maxRateHz;
  if (f.useWindow) caps.window = { seconds: f.windowSeconds, maxPulses: f.windowMaxPulses };
  return {
    ceilingHz: f.ceilingHz,
    refractory: { absoluteMs: f.absoluteMs, recoveryMs: f.recoveryMs },
    ...(f.useMaxRate || f.useWindow ? { caps } : {}),
    pulse: {
      widthMs: f.widthMs,
      amplitude: f.amplitude,
      unit: f.unit,
      ...(f.unit === 'uA' ? { phases: { widthUs: f.phaseWidthUs, gapUs: f.phaseGapUs, leading: f.leading } } : {}),
    },
    trials: f.trials,
    seed,
    clockHz: f.clockHz,
  };
}

/** Where a spec error shows in the settings form; null for errors that belong elsewhere (envelope, seed). */
export function settingsFieldOf(path: string): keyof SettingsForm | null {
  const map: Record<string, keyof SettingsForm> = {
    ceilingHz: 'ceilingHz',
    'refractory.absoluteMs': 'absoluteMs',
    'refractory.recoveryMs': 'recoveryMs',
    caps: 'maxRateHz',
    'caps.maxRateHz': 'maxRateHz',
    'caps.window': 'windowSeconds',
    'caps.window.seconds': 'windowSeconds',
    'caps.window.maxPulses': 'windowMaxPulses',
    pulse: 'widthMs',
    'pulse.unit': 'unit',
    'pulse.widthMs': 'widthMs',
    'pulse.amplitude': 'amplitude',
    'pulse.phases': 'unit',
    'pulse.phases.widthUs': 'phaseWidthUs',
    'pulse.phases.gapUs': 'phaseGapUs',
    'pulse.phases.leading': 'leading',
    refractory: 'absoluteMs',
    trials: 'trials',
    clockHz: 'clockHz',
  };
  return map[path] ?? null;
}
