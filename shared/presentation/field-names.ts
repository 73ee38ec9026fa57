/*
 * Fields of a budget file named in words, with the symbol metrology gives
 * them (JCGM 100:2008 for the GUM quantities, JCGM 101:2008 for the Monte
 * Carlo settings), for screens that list what changed between versions.
 */

/** Fields of an input's distribution, a constant, a correlation or the measurand, by their path inside that entry. */
const ENTRY_FIELDS: Record<string, string> = {
  symbol: 'symbol',
  unit: 'unit',
  description: 'description',
  distribution: 'distribution',
  kind: 'distribution',
  value: 'value',
  u: 'standard uncertainty u',
  U: 'expanded uncertainty U',
  k: 'coverage factor k',
  p: 'coverage probability p',
  halfWidth: 'half-width a',
  lower: 'lower limit a₋',
  upper: 'upper limit a₊',
  beta: 'ratio β of the half-widths',
  halfWidthUncertainty: 'uncertainty d of the half-width',
  scale: 'scale s',
  dof: 'degrees of freedom ν',
  relativeUncertaintyOfU: 'relative uncertainty of u, Δu/u',
  values: 'observations',
  pooledSd: 'pooled standard deviation s_p',
  pooledDof: 'degrees of freedom of s_p',
  uncertaintyUnit: 'uncertainty unit',
  stated: 'stated as',
  'stated.as': 'stated as',
  'stated.source': 'source of the statement',
  between: 'correlated quantities',
  r: 'correlation coefficient r',
};

/** Top-level fields of the budget file. */
const BUDGET_FIELDS: Record<string, string> = {
  format: 'file format',
  title: 'title',
  model: 'model',
  coverageProbability: 'coverage probability p',
  monteCarlo: 'Monte Carlo settings',
  'monteCarlo.trials': 'trials M',
  'monteCarlo.seed': 'seed',
  'monteCarlo.significantDigits': 'significant decimal digits n_dig',
  reporting: 'reporting of U',
  'reporting.basis': 'basis of the coverage factor',
  'reporting.k': 'coverage factor k',
  'reporting.whenNotValidated': 'when the GUM result is not validated',
  procedure: 'procedure',
  equipment: 'equipment',
  environment: 'environment',
};

/**
 * The words for a changed field of a budget file, given its dotted path as the
 * version comparison reports it: a top-level field (`monteCarlo.trials`), or a
 * field inside one input, constant, correlation or the measurand
 * (`distribution.halfWidth`, `unit`, `r`). A path it does not know is returned
 * as it is, so a field added to the format later still shows.
 */
export function fieldName(path: string): string {
  if (Object.hasOwn(BUDGET_FIELDS, path)) return BUDGET_FIELDS[path];
  const inEntry = path.startsWith('distribution.') ? path.slice('distribution.'.length) : path;
  return Object.hasOwn(ENTRY_FIELDS, inEntry) ? ENTRY_FIELDS[inEntry] : path;
}
