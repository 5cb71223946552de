/**
 * Reference-electrode constants at 25 °C. Aqueous references are given against SHE;
 * non-aqueous ones (Fc+/Fc, Ag/Ag+) against an aqueous SCE in a named solvent, as they
 * were measured.
 */

export type ReferenceElectrode =
  'SHE' | 'SCE' | 'Ag/AgCl (sat. KCl)' | 'Ag/AgCl (3 M KCl)' | 'Fc+/Fc' | 'Ag/Ag+ (0.01 M AgNO3)';

export type AqueousReference = 'SHE' | 'SCE' | 'Ag/AgCl (sat. KCl)' | 'Ag/AgCl (3 M KCl)';

export interface SourcedConstant {
  /** V */
  value: number;
  source: string;
}

/** Potential of each aqueous reference against SHE, V. */
export const AQUEOUS_REFERENCES: Readonly<Record<AqueousReference, SourcedConstant>> = {
  SHE: { value: 0, source: 'definition' },
  // Without liquid junction. Sawyer et al. list 0.244 V with junction; we keep one source.
  SCE: {
    value: 0.2412,
    source:
      'Bard & Faulkner, Electrochemical Methods, 2nd ed., table inside back cover (as tabulated by eDAQ and consultrsr.net)',
  },
  'Ag/AgCl (sat. KCl)': {
    value: 0.197,
    source:
      'Bard & Faulkner, Electrochemical Methods, 2nd ed. (via consultrsr.net); 0.1970 V in Int. J. Corros. 2010, Table 2',
  },
  'Ag/AgCl (3 M KCl)': {
    value: 0.21,
    source:
      'Inzelt et al., Handbook of Reference Electrodes (Springer 2013), via echemdb; same 0.210 V in consultrsr.net and PMC6192533',
  },
};

export type NonAqueousReference = 'Fc+/Fc' | 'Ag/Ag+ (0.01 M AgNO3)';

/** Non-aqueous references against aqueous SCE, by solvent id (see SOLVENTS), V. */
export const NON_AQUEOUS_REFERENCES: Readonly<Record<string, Partial<Record<NonAqueousReference, SourcedConstant>>>> = {
  acetonitrile: {
    // 0.380 V, not the 0.40 V of Connelly & Geiger: P&A is the measured, more specific
    // value, its Ag/Ag+ entry below comes from the same work (Fc vs Ag/Ag+ = 0.082 V),
    // and the Ru(bpy)3 3+/2+ potential reported vs Fc (+0.92) and vs SCE (+1.29)
    // differs by 0.37 V.
    'Fc+/Fc': {
      value: 0.38,
      source: 'Pavlishchuk & Addison, Inorg. Chim. Acta 2000, 298, 97 (0.1 M Bu4NPF6, 25 °C)',
    },
    'Ag/Ag+ (0.01 M AgNO3)': {
      value: 0.298,
      source: 'Pavlishchuk & Addison, Inorg. Chim. Acta 2000, 298, 97 (0.1 M Bu4N+ salt)',
    },
  },
  dichloromethane: {
    // Secondary source only; measured values of 0.48-0.51 V (PMC8336439) lie above it.
    'Fc+/Fc': {
      value: 0.46,
      source: 'Connelly & Geiger, Chem. Rev. 1996, 96, 877, Table 1 (0.1 M Bu4NPF6; read in a secondary copy)',
    },
  },
  thf: {
    'Fc+/Fc': {
      value: 0.56,
      source: 'Connelly & Geiger, Chem. Rev. 1996, 96, 877, Table 1 (0.1 M Bu4NPF6; read in a secondary copy)',
    },
  },
};

export const REFERENCE_ELECTRODES: readonly ReferenceElectrode[] = [
  'SHE',
  'SCE',
  'Ag/AgCl (sat. KCl)',
  'Ag/AgCl (3 M KCl)',
  'Fc+/Fc',
  'Ag/Ag+ (0.01 M AgNO3)',
];

export function isAqueousReference(reference: ReferenceElectrode): reference is AqueousReference {
  return Object.hasOwn(AQUEOUS_REFERENCES, reference);
}
