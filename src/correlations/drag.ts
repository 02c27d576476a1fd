import type { Correlation, CorrelationInput, ReturnedQuantity } from './types.js';

/**
 * Drag coefficient of a smooth rigid sphere, C_D = F_D/(rho*U^2/2 * pi*d^2/4), against the particle
 * Reynolds number Re = rho*U*d/mu (fluid density and viscosity, relative velocity U, diameter d).
 * Formulas and printings as in check-values.md section 2.1.
 */

const CD: ReturnedQuantity = { symbol: 'C_D', name: 'drag coefficient C_D = F_D/(rho*U^2/2 * pi*d^2/4) of a sphere' };
const RE: CorrelationInput = { name: 'Re', meaning: 'particle Reynolds number rho*U*d/mu (fluid properties, relative velocity, sphere diameter)' };

function re0(x: readonly number[]): number {
  const re = x[0] ?? NaN;
  return re > 0 ? re : NaN;
}

export const STOKES: Correlation = {
  id: 'stokes',
  title: 'Stokes creeping flow',
  family: 'sphere-drag',
  returns: CD,
  inputs: [RE],
  equation: { left: 'C_D', right: '24/Re' },
  words: 'twenty-four over the Reynolds number',
  // Stokes (1851), Trans. Camb. Phil. Soc. 9:8-106 (citation from memory).
  source: 'Stokes (1851), Trans. Camb. Philos. Soc. 9(2):8-106',
  range: [
    {
      input: 'Re',
      max: 0.1,
      source: 'common practice: against the standard drag curve (Morsi & Alexander 1972, Table 1) Stokes is 2 % low at Re = 0.1 and 9 % low at Re = 1',
    },
  ],
  powerLaw: { Re: -1 },
  // Stokes (1851): C_D = 24/Re.
  value: (x) => 24 / re0(x),
};

export const OSEEN: Correlation = {
  id: 'oseen',
  title: 'Oseen first inertial correction',
  family: 'sphere-drag',
  returns: CD,
  inputs: [RE],
  equation: { left: 'C_D', right: '24/Re*(1 + 3*Re/16)' },
  words: 'Stokes drag times (1 + 3 Re/16)',
  // Oseen (1910), Ark. Mat. Astron. Fys. 6(29) (citation from memory).
  source: 'Oseen (1910), Ark. Mat. Astron. Fys. 6(29):1-20',
  range: [{ input: 'Re', max: 1, source: 'Oseen (1910): first-order correction for small Re; common practice Re below about 1' }],
  // Oseen (1910): C_D = (24/Re)(1 + 3Re/16).
  value: (x) => {
    const re = re0(x);
    return (24 / re) * (1 + (3 * re) / 16);
  },
};

export const SCHILLER_NAUMANN: Correlation = {
  id: 'schiller-naumann',
  title: 'Schiller-Naumann intermediate regime',
  family: 'sphere-drag',
  returns: CD,
  inputs: [RE],
  equation: { left: 'C_D', right: '24/Re*(1 + 0.15*Re^0.687)' },
  words: 'Stokes drag times (1 + 0.15 Re^0.687)',
  // Schiller & Naumann (1933), Z. Ver. Dtsch. Ing. 77:318-320.
  source: 'Schiller & Naumann (1933), Z. Ver. Dtsch. Ing. 77:318-320',
  range: [{ input: 'Re', max: 800, source: 'Clift, Grace & Weber (1978), Bubbles, Drops and Particles, Academic Press, ch. 5: Re < 800' }],
  accuracy: 'Within about +5/-4 % of the standard drag curve below Re = 800 (Clift, Grace & Weber 1978).',
  // Schiller & Naumann (1933): C_D = (24/Re)(1 + 0.15 Re^0.687).
  value: (x) => {
    const re = re0(x);
    return (24 / re) * (1 + 0.15 * Math.pow(re, 0.687));
  },
};

export const CLIFT_GAUVIN: Correlation = {
  id: 'clift-gauvin',
  title: 'Clift-Gauvin (usual printing)',
  family: 'sphere-drag',
  returns: CD,
  inputs: [RE],
  equation: { left: 'C_D', right: '24/Re*(1 + 0.15*Re^0.687) + 0.42/(1 + 4.25e4*Re^(-1.16))' },
  words: 'Schiller-Naumann plus 0.42/(1 + 42500 Re^-1.16), which carries it to the Newton regime',
  // Clift & Gauvin (1970), Proc. Chemeca 70, 1:14-28, as printed in Clift, Grace & Weber (1978) (both from memory).
  source: 'Clift & Gauvin (1970), Proc. Chemeca 70, Butterworths, 1:14-28; as printed in Clift, Grace & Weber (1978), Table 5.2',
  range: [{ input: 'Re', max: 3e5, source: 'Clift, Grace & Weber (1978): below the drag crisis, Re < 3e5' }],
  method:
    "Pinned printing: 0.15 Re^0.687 and 0.42/(1 + 4.25e4 Re^-1.16), the form of Clift, Grace & Weber (1978). The printing of Barati et al. (2014) differs by up to 3 % below Re = 1e4 and up to 6 % near Re = 2e5; it is the separate id 'clift-gauvin-barati'.",
  accuracy: 'About +-6 % of the standard drag curve (Clift, Grace & Weber 1978); measured here -4.0 to +6.6 % against the Morsi & Alexander (1972) tabulation.',
  // Clift & Gauvin (1970): C_D = (24/Re)(1 + 0.15 Re^0.687) + 0.42/(1 + 4.25e4 Re^-1.16).
  value: (x) => {
    const re = re0(x);
    return (24 / re) * (1 + 0.15 * Math.pow(re, 0.687)) + 0.42 / (1 + 4.25e4 * Math.pow(re, -1.16));
  },
};

export const CLIFT_GAUVIN_BARATI: Correlation = {
  id: 'clift-gauvin-barati',
  title: 'Clift-Gauvin (as printed by Barati et al. 2014)',
  family: 'sphere-drag',
  returns: CD,
  inputs: [RE],
  equation: { left: 'C_D', right: '24/Re*(1 + 0.152*Re^0.677) + 0.417/(1 + 5070*Re^(-0.94))' },
  words: "Stokes drag times (1 + 0.152 Re^0.677) plus 0.417/(1 + 5070 Re^-0.94): the second printing of Clift-Gauvin",
  // Barati, Neyshabouri & Ahmadi (2014), Powder Technol. 257:11-19, Table 1 (citation from memory; the
  // coefficients are [S] in check-values.md 2.1).
  source: 'Barati, Neyshabouri & Ahmadi (2014), Powder Technol. 257:11-19: their printing of Clift & Gauvin (1970)',
  range: [{ input: 'Re', max: 2e5, source: 'Barati et al. (2014): Re <= 2e5' }],
  method: "Kept because it circulates; it differs from the usual printing ('clift-gauvin') by up to 3 % below Re = 1e4 and up to 6 % near Re = 2e5. Say which one a comparison used.",
  // Barati et al. (2014) printing: C_D = (24/Re)(1 + 0.152 Re^0.677) + 0.417/(1 + 5070 Re^-0.94).
  value: (x) => {
    const re = re0(x);
    return (24 / re) * (1 + 0.152 * Math.pow(re, 0.677)) + 0.417 / (1 + 5070 * Math.pow(re, -0.94));
  },
};

export const HAIDER_LEVENSPIEL: Correlation = {
  id: 'haider-levenspiel',
  title: 'Haider-Levenspiel, spheres',
  family: 'sphere-drag',
  returns: CD,
  inputs: [RE],
  equation: { left: 'C_D', right: '24/Re*(1 + 0.1806*Re^0.6459) + 0.4251/(1 + 6880.95/Re)' },
  words: 'Stokes drag times (1 + 0.1806 Re^0.6459) plus 0.4251/(1 + 6880.95/Re)',
  // Haider & Levenspiel (1989), Powder Technol. 58:63-70, eq. (10) for spheres (equation number from memory).
  source: 'Haider & Levenspiel (1989), Powder Technol. 58:63-70 (sphere form)',
  range: [{ input: 'Re', max: 2.6e5, source: 'Haider & Levenspiel (1989): Re < 2.6e5' }],
  // Haider & Levenspiel (1989), spheres: C_D = (24/Re)(1 + 0.1806 Re^0.6459) + 0.4251/(1 + 6880.95/Re).
  value: (x) => {
    const re = re0(x);
    return (24 / re) * (1 + 0.1806 * Math.pow(re, 0.6459)) + 0.4251 / (1 + 6880.95 / re);
  },
};

export const MORRISON_2013: Correlation = {
  id: 'morrison-2013',
  title: 'Morrison, through the drag crisis',
  family: 'sphere-drag',
  returns: CD,
  inputs: [RE],
  equation: {
    left: 'C_D',
    right:
      '24/Re + 2.6*(Re/5)/(1 + (Re/5)^1.52) + 0.411*(Re/2.63e5)^(-7.94)/(1 + (Re/2.63e5)^(-8)) + 0.25*(Re/1e6)/(1 + Re/1e6)',
  },
  words: 'four terms: Stokes drag, an intermediate hump, a drop at the drag crisis near Re = 2.6e5, and a slow rise beyond 1e6',
  // Morrison (2013), An Introduction to Fluid Mechanics, Cambridge University Press; printing of the
  // Michigan Tech note of 10 Nov 2016, eq. (1) (check-values.md 2.1).
  source: 'Morrison (2013), An Introduction to Fluid Mechanics, Cambridge University Press; eq. (1) of his 2016 data-correlation note',
  range: [{ input: 'Re', max: 1e6, source: 'Morrison (2016 note): Re <= 1e6' }],
  method:
    'Pinned printing: the 2013 book / 2016 note, last term 0.25(Re/1e6)/(1 + Re/1e6). The 2010 note ends with Re^0.80/461000 instead; the two differ only above Re = 1e4. The third term is computed as 0.411 r^0.06/(r^8 + 1), r = Re/2.63e5 (the same value, without overflow at small Re).',
  // Morrison (2013): C_D = 24/Re + 2.6(Re/5)/(1+(Re/5)^1.52) + 0.411(Re/2.63e5)^-7.94/(1+(Re/2.63e5)^-8) + 0.25(Re/1e6)/(1+Re/1e6).
  value: (x) => {
    const re = re0(x);
    const r5 = re / 5;
    const rc = re / 2.63e5;
    const r6 = re / 1e6;
    return 24 / re + (2.6 * r5) / (1 + Math.pow(r5, 1.52)) + (0.411 * Math.pow(rc, 0.06)) / (Math.pow(rc, 8) + 1) + (0.25 * r6) / (1 + r6);
  },
};

export const BROWN_LAWLER_2003: Correlation = {
  id: 'brown-lawler-2003',
  title: 'Brown-Lawler, wall-corrected data',
  family: 'sphere-drag',
  returns: CD,
  inputs: [RE],
  equation: { left: 'C_D', right: '24/Re*(1 + 0.150*Re^0.681) + 0.407/(1 + 8710/Re)' },
  words: 'Stokes drag times (1 + 0.150 Re^0.681) plus 0.407/(1 + 8710/Re)',
  // Brown & Lawler (2003), J. Environ. Eng. 129(3):222-231, eq. (19) (formula and equation number from memory;
  // check-values.md 2.1 marks it [M]; it tracks the Barati printing of Clift-Gauvin within 0.5 %).
  source: 'Brown & Lawler (2003), J. Environ. Eng. 129(3):222-231',
  range: [{ input: 'Re', max: 2e5, source: 'Brown & Lawler (2003): fitted to about 480 wall-corrected points, Re < 2e5' }],
  // Brown & Lawler (2003): C_D = (24/Re)(1 + 0.150 Re^0.681) + 0.407/(1 + 8710/Re).
  value: (x) => {
    const re = re0(x);
    return (24 / re) * (1 + 0.15 * Math.pow(re, 0.681)) + 0.407 / (1 + 8710 / re);
  },
};

/** The sphere drag laws, in the order they are listed. */
export const DRAG_CORRELATIONS: readonly Correlation[] = [
  STOKES,
  OSEEN,
  SCHILLER_NAUMANN,
  CLIFT_GAUVIN,
  CLIFT_GAUVIN_BARATI,
  HAIDER_LEVENSPIEL,
  MORRISON_2013,
  BROWN_LAWLER_2003,
];
