type Hardware = {
  modality: 'optical' | 'electrical';
  wavelengthNm: number | null;
  fibreCoreUm: number | null;
  fibreNA: number | null;
  electrodeMaterial: string | null;
  electrodeAreaMm2: number | null;
};

/** One line of a rig's light path or electrode, with a dash for what was never entered. */
export function rigHardware(r: Hardware): string {
  const v = (x: number | string | null) => (x === null || x === '' ? '—' : String(x));
  return r.modality === 'optical'
    ? `${v(r.wavelengthNm)} nm, ${v(r.fibreCoreUm)} µm core, NA ${v(r.fibreNA)}`
    : `${v(r.electrodeMaterial)}, ${v(r.electrodeAreaMm2)} mm²`;
}
