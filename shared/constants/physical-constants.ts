/** A physical constant a budget can add as a constant (exact) or as a normal input (with its u). */
export interface PhysicalConstant {
  id: string;
  /** Suggested budget symbol. */
  symbol: string;
  name: string;
  value: number;
  /** Standard uncertainty; 0 for exact values. */
  standardUncertainty: number;
  unit: string;
  source: 'SI defining constant' | 'CODATA 2018' | 'conventional';
}

/** The seven defining constants of the SI (SI Brochure, 9th edition, 2019, Table 1): exact by definition. */
export const SI_DEFINING_CONSTANTS: readonly PhysicalConstant[] = [
  { id: 'dnu_Cs', symbol: 'dnu_Cs', name: 'hyperfine transition frequency of Cs-133', value: 9192631770, standardUncertainty: 0, unit: 'Hz', source: 'SI defining constant' },
  { id: 'c', symbol: 'c0', name: 'speed of light in vacuum', value: 299792458, standardUncertainty: 0, unit: 'm/s', source: 'SI defining constant' },
  { id: 'h', symbol: 'h_P', name: 'Planck constant', value: 6.62607015e-34, standardUncertainty: 0, unit: 'J s', source: 'SI defining constant' },
  { id: 'e', symbol: 'q_e', name: 'elementary charge', value: 1.602176634e-19, standardUncertainty: 0, unit: 'C', source: 'SI defining constant' },
  { id: 'k', symbol: 'k_B', name: 'Boltzmann constant', value: 1.380649e-23, standardUncertainty: 0, unit: 'J/K', source: 'SI defining constant' },
  { id: 'N_A', symbol: 'N_A', name: 'Avogadro constant', value: 6.02214076e23, standardUncertainty: 0, unit: '1/mol', source: 'SI defining constant' },
  { id: 'K_cd', symbol: 'K_cd', name: 'luminous efficacy of 540 THz radiation', value: 683, standardUncertainty: 0, unit: 'cd/W', source: 'SI defining constant' },
];

/**
 * Other frequently used constants: CODATA 2018 recommended values with their
 * standard uncertainties (values as recalled from the CODATA 2018 tables;
 * exact ones follow from the defining constants), and the conventional g_n.
 */
export const CODATA_2018: readonly PhysicalConstant[] = [
  { id: 'G', symbol: 'G_N', name: 'Newtonian constant of gravitation', value: 6.6743e-11, standardUncertainty: 0.00015e-11, unit: 'm^3 kg^-1 s^-2', source: 'CODATA 2018' },
  { id: 'm_e', symbol: 'm_e', name: 'electron mass', value: 9.1093837015e-31, standardUncertainty: 0.0000000028e-31, unit: 'kg', source: 'CODATA 2018' },
  { id: 'm_p', symbol: 'm_p', name: 'proton mass', value: 1.67262192369e-27, standardUncertainty: 0.00000000051e-27, unit: 'kg', source: 'CODATA 2018' },
  { id: 'm_u', symbol: 'm_u', name: 'atomic mass constant', value: 1.6605390666e-27, standardUncertainty: 0.0000000005e-27, unit: 'kg', source: 'CODATA 2018' },
  { id: 'alpha', symbol: 'alpha_fs', name: 'fine-structure constant', value: 7.2973525693e-3, standardUncertainty: 0.0000000011e-3, unit: '1', source: 'CODATA 2018' },
  { id: 'R_inf', symbol: 'R_inf', name: 'Rydberg constant', value: 10973731.56816, standardUncertainty: 0.000021, unit: '1/m', source: 'CODATA 2018' },
  { id: 'mu_0', symbol: 'mu_0', name: 'vacuum magnetic permeability', value: 1.25663706212e-6, standardUncertainty: 0.00000000019e-6, unit: 'N/A^2', source: 'CODATA 2018' },
  { id: 'epsilon_0', symbol: 'eps_0', name: 'vacuum electric permittivity', value: 8.8541878128e-12, standardUncertainty: 0.0000000013e-12, unit: 'F/m', source: 'CODATA 2018' },
  { id: 'R', symbol: 'R_gas', name: 'molar gas constant', value: 8.314462618, standardUncertainty: 0, unit: 'J/(mol K)', source: 'CODATA 2018' },
  { id: 'F', symbol: 'F_c', name: 'Faraday constant', value: 96485.33212, standardUncertainty: 0, unit: 'C/mol', source: 'CODATA 2018' },
  { id: 'sigma', symbol: 'sigma_SB', name: 'Stefan–Boltzmann constant', value: 5.670374419e-8, standardUncertainty: 0, unit: 'W m^-2 K^-4', source: 'CODATA 2018' },
  { id: 'a_0', symbol: 'a_0', name: 'Bohr radius', value: 5.29177210903e-11, standardUncertainty: 0.0000000008e-11, unit: 'm', source: 'CODATA 2018' },
  { id: 'g_n', symbol: 'g_n', name: 'standard acceleration of gravity', value: 9.80665, standardUncertainty: 0, unit: 'm/s^2', source: 'conventional' },
];

export const PHYSICAL_CONSTANTS: readonly PhysicalConstant[] = [...SI_DEFINING_CONSTANTS, ...CODATA_2018];
