/** Stored with every computed version, so a result can be traced to the engine that produced it. */
// 0.2.0: normal draws by the ziggurat, so a seed gives other Monte Carlo numbers than 0.1.0.
// 0.2.1: ỹ and u(ỹ) gathered block by block (one shifted pass per block), the histogram from the interval search's bucket counts:
// u can differ from 0.2.0 in the last digits, a value within rounding of a bin edge can change bins.
// 0.3.0: rectangular, triangular, trapezoidal and arcsine inputs drawn from 32-bit uniforms (one generator output per uniform
// instead of two), so a seed gives other Monte Carlo numbers than 0.2.1.
// 0.4.0: normal inputs with `dof` drawn from the scaled and shifted t (JCGM 101:2008 6.4.9.7), so such budgets give other
// Monte Carlo numbers than 0.3.0; validation verdicts with the endpoints' numerical uncertainty; `reported`.
// 0.5.0: normal draws take one 32-bit generator output per ziggurat attempt instead of two, so a seed gives other Monte
// Carlo numbers than 0.4.0; ỹ and u(ỹ) summed in the model kernel itself (u can differ in the last digits).
export const ENGINE_VERSION = 'dubito-engine/0.5.0';
