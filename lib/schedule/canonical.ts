/**
 * Canonical form of a spec: fixed key order, optional parts present only when given.
 * Two specs that mean the same thing serialize to the same bytes, so the manifest's
 * spec (and its hash) does not depend on how an editor happened to order keys.
 */
import type { Segment, Spec } from './spec';

function canonicalSegment(s: Segment): Segment {
  if (s.kind === 'ramp') return { kind: 'ramp', durationS: s.durationS, fromHz: s.fromHz, toHz: s.toHz };
  return {
    kind: 'sine',
    durationS: s.durationS,
    meanHz: s.meanHz,
    depthHz: s.depthHz,
    freqHz: s.freqHz,
    phaseDeg: s.phaseDeg,
  };
}

export function canonicalSpec(spec: Spec): Spec {
  const pulse: Spec['pulse'] = { widthMs: spec.pulse.widthMs, amplitude: spec.pulse.amplitude, unit: spec.pulse.unit };
  if (spec.pulse.phases) {
    const p = spec.pulse.phases;
    pulse.phases = { widthUs: p.widthUs, gapUs: p.gapUs, leading: p.leading };
  }
  let caps: Spec['caps'];
  if (spec.caps) {
    caps = {};
    if (spec.caps.maxRateHz !== undefined) caps.maxRateHz = spec.caps.maxRateHz;
    if (spec.caps.window) caps.window = { seconds: spec.caps.window.seconds, maxPulses: spec.caps.window.maxPulses };
  }
  return {
    format: spec.format,
    envelope: spec.envelope.map(canonicalSegment),
    ceilingHz: spec.ceilingHz,
    refractory: { absoluteMs: spec.refractory.absoluteMs, recoveryMs: spec.refractory.recoveryMs },
    ...(caps ? { caps } : {}),
    pulse,
    trials: spec.trials,
    seed: spec.seed,
    clockHz: spec.clockHz,
  };
}

export function canonicalSpecJson(spec: Spec): string {
  return JSON.stringify(canonicalSpec(spec));
}
