import type { Role } from '../lib/auth/roles';

/** The invented demo scenario. No real people, institutions or data. */
export const DEMO = {
  password: 'pulseloom-demo',
  labs: [
    { slug: 'harbor-lane', name: 'Harbor Lane Circuits Lab' },
    { slug: 'ridgeway', name: 'Ridgeway Sensory Lab' },
  ],
  people: [
    { email: 'ada.quill@harborlane.test', name: 'Ada Quill', roles: { 'harbor-lane': ['experimenter'] as Role[] } },
    { email: 'tomas.reyes@harborlane.test', name: 'Tomás Reyes', roles: { 'harbor-lane': ['safety_officer'] as Role[] } },
    {
      email: 'noor.hale@harborlane.test',
      name: 'Noor Hale',
      roles: { 'harbor-lane': ['lab_admin'] as Role[], ridgeway: ['lab_admin', 'experimenter'] as Role[] },
    },
    {
      email: 'ines.okafor@ridgeway.test',
      name: 'Inès Okafor',
      roles: { ridgeway: ['experimenter', 'safety_officer'] as Role[] },
    },
  ],
  rigs: [
    {
      lab: 'harbor-lane',
      name: 'Bench 2 — blue light',
      modality: 'optical' as const,
      clockHz: 10_000,
      channels: 2,
      wavelengthNm: 473,
      fibreCoreUm: 200,
      fibreNA: 0.39,
      notes: 'Head-fixed behaviour bench, 473 nm diode laser, patch cord to a 200 µm implant.',
    },
    {
      lab: 'harbor-lane',
      name: 'Bench 5 — microstim',
      modality: 'electrical' as const,
      clockHz: 30_000,
      channels: 4,
      electrodeMaterial: 'platinum–iridium',
      electrodeAreaMm2: 0.0314,
      notes: 'Isolated current stimulator; bipolar Pt–Ir electrodes.',
    },
    {
      lab: 'ridgeway',
      name: 'Whisker rig',
      modality: 'optical' as const,
      clockHz: 20_000,
      channels: 1,
      wavelengthNm: 470,
      fibreCoreUm: 400,
      fibreNA: 0.5,
      notes: '',
    },
  ],
};
