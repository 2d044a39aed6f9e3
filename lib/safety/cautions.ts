import type { Modality } from '../schedule/spec';
import { SOURCES } from './sources';

// One source for the cautions shown on the safety sheet and in the export dialog, so
// the two can never drift apart. Plain words; the sources list says where a claim
// comes from, and 'practice' marks advice that is common practice without a source.

export interface Caution {
  id: 'light-heat' | 'laser-eye' | 'charge-damage' | 'measure-output' | 'approval';
  title: string;
  body: string;
  appliesTo: readonly Modality[];
  sources: readonly string[];
}

export const SAFETY_DISCLAIMER =
  'This sheet supports, and does not replace, the institution’s approved animal protocol, ' +
  'local regulations and licensed practice. Its numbers are computed from the spec and the ' +
  'rig record with published formulas; passing every row does not show that a stimulus is ' +
  'safe for a particular animal, fibre or electrode.';

export const CAUTIONS: readonly Caution[] = [
  {
    id: 'light-heat',
    title: 'Light heats tissue',
    body:
      'Light from the fibre warms the tissue near the tip, and the warming follows average power, ' +
      'so long trains and dense bursts matter more than a single pulse. Common protocols have ' +
      'warmed the brain by 0.2–2 °C, enough to change firing and behaviour, and bright light can ' +
      'change firing in animals without any opsin. Models can understate heating up to tenfold. ' +
      'Run light-only controls.',
    appliesTo: ['optical'],
    sources: [SOURCES.owen2019, SOURCES.stujenske2015, SOURCES.ariasGil2016],
  },
  {
    id: 'laser-eye',
    title: 'Laser eye safety',
    body:
      'The light sources used here can injure eyes. Wear eyewear rated for the wavelength, cap ' +
      'fibre ends that are not connected, switch the source off before handling patch cords, and ' +
      'follow the institution’s laser safety rules.',
    appliesTo: ['optical'],
    sources: [SOURCES.practice],
  },
  {
    id: 'charge-damage',
    title: 'Charge can damage tissue and electrodes',
    body:
      'Tissue damage depends on charge per phase and charge density together. Shannon’s limit was ' +
      'fitted to macroelectrode data and does not hold for microelectrodes, which need their own ' +
      'justification. Keep pulses charge-balanced, stay within the electrode material’s reversible ' +
      'charge injection, and block DC at the output.',
    appliesTo: ['electrical'],
    sources: [SOURCES.mccreery1990, SOURCES.shannon1992, SOURCES.cogan2016, SOURCES.merrill2005, SOURCES.vanDongen2015],
  },
  {
    id: 'measure-output',
    title: 'Measure what the rig delivers',
    body:
      'The sheet trusts the spec and the rig record. Measure light power at the fibre tip, or ' +
      'current through a test load, before a session, and update the rig record whenever a fibre ' +
      'or electrode is changed.',
    appliesTo: ['optical', 'electrical'],
    sources: [SOURCES.practice],
  },
  {
    id: 'approval',
    title: 'Your approval comes first',
    body: SAFETY_DISCLAIMER,
    appliesTo: ['optical', 'electrical'],
    sources: [SOURCES.practice],
  },
];

/** Cautions for one modality, in display order; the approval caution is always last. */
export function cautionsFor(modality: Modality): Caution[] {
  return CAUTIONS.filter((c) => c.appliesTo.includes(modality));
}
