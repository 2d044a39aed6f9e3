// Every rule on the safety sheet names where its formula comes from. The strings live
// here once so the sheet, its help texts and the tests quote the same wording.
// Tags follow the project's facts list: (a) read in the named source, (b) recalled
// from memory, to be verified before a hard rule depends on it, (c) common practice
// or arithmetic, no source.

export const SOURCES = {
  shannon1992:
    'Shannon (1992), A model of safe levels for electrical stimulation, IEEE Trans. Biomed. Eng. 39(4):424-426, doi:10.1109/10.126616 (a)',
  cogan2016:
    'Cogan, Ludwig, Welle & Takmakov (2016), J. Neural Eng. 13:021001: the Shannon model does not hold for microelectrodes (a)',
  cogan2016Threshold:
    'Cogan et al. (2016), J. Neural Eng. 13:021001: microelectrodes taken as geometric area below 10 000 µm² (b, threshold recalled from memory)',
  mccreery1990:
    'McCreery et al. (1990), IEEE Trans. Biomed. Eng.: charge density and charge per phase act together (a)',
  merrill2005:
    'Merrill, Bikson & Jefferys (2005), J. Neurosci. Methods 141:171-198 (a)',
  vanDongen2015:
    'van Dongen & Serdijn (2015), Med. Biol. Eng. Comput.: DC blocking as a safeguard (a)',
  yizhar2011:
    'Yizhar et al. (2011), Neuron 71:9-34: heating estimate without conduction (b)',
  shin2016:
    'Shin et al. (2016), Biomed. Opt. Express 7(11):4450: about 0.116 °C/mW at 563 µm, up to 0.25 °C/mW at 100 µm, 473 nm (a)',
  owen2019:
    'Owen, Liu & Kreitzer (2019), Nat. Neurosci. 22:1061-1065: 0.2-2 °C rises change spiking and behaviour (a)',
  ariasGil2016:
    'Arias-Gil et al. (2016), Neurophotonics 3(4):045007: irreversible damage at 6-8 K; models can underestimate heating tenfold (a)',
  stujenske2015:
    'Stujenske, Spellman & Gordon (2015), Cell Rep. 12:525-534: strong light changes firing without opsin (a)',
  aravanis2007:
    'Aravanis et al. (2007), J. Neural Eng. 4:S143: light spread model, an estimate only (b)',
  knoll2010:
    'Knoll, Radiation Detection and Measurement, 4th ed. (2010), ch. 4: non-paralyzable dead time (b)',
  geometry: 'Area of a circle, arithmetic (c)',
  arithmetic: 'Arithmetic on the spec (c)',
  measured: 'Measured on the generated schedule (c)',
  practice: 'common practice, no source (c)',
  labLimit: 'limit chosen by the lab in its profile',
} as const;

export type SourceKey = keyof typeof SOURCES;
