import { describe, expect, it } from 'vitest';
import { addPhysicalConstant } from '../../shared/constants/add-constant';
import { CODATA_2018, PHYSICAL_CONSTANTS, SI_DEFINING_CONSTANTS } from '../../shared/constants/physical-constants';
import { computeBudget } from '../../shared/compute/compute-budget';
import { parseUnit } from '../../shared/model/units';
import { budget, N } from '../support/budget-builder';

describe('physical constants', () => {
  it('holds the seven SI defining constants, exact (SI Brochure 9th ed., Table 1)', () => {
    expect(SI_DEFINING_CONSTANTS).toHaveLength(7);
    expect(SI_DEFINING_CONSTANTS.every((c) => c.standardUncertainty === 0)).toBe(true);
    const byId = Object.fromEntries(SI_DEFINING_CONSTANTS.map((c) => [c.id, c.value]));
    expect(byId.c).toBe(299792458);
    expect(byId.h).toBe(6.62607015e-34);
    expect(byId.e).toBe(1.602176634e-19);
    expect(byId.k).toBe(1.380649e-23);
    expect(byId.N_A).toBe(6.02214076e23);
  });

  it('derives the exact CODATA 2018 values from the defining constants: R = N_A·k, F = N_A·e', () => {
    const R = CODATA_2018.find((c) => c.id === 'R')!.value;
    const F = CODATA_2018.find((c) => c.id === 'F')!.value;
    expect(R).toBeCloseTo(6.02214076e23 * 1.380649e-23, 8);
    expect(F).toBeCloseTo(6.02214076e23 * 1.602176634e-19, 4);
  });

  it('gives every constant a unit the engine understands and a unique symbol', () => {
    for (const c of PHYSICAL_CONSTANTS) expect(() => parseUnit(c.unit)).not.toThrow();
    expect(new Set(PHYSICAL_CONSTANTS.map((c) => c.symbol)).size).toBe(PHYSICAL_CONSTANTS.length);
  });

  it('adds an exact constant as a constant and an uncertain one as a normal input', () => {
    const doc = budget('F = m * a', { m: [N(2, 0.001), 'kg'], a: [N(9.8, 0.01), 'm/s^2'] });
    const gN = PHYSICAL_CONSTANTS.find((c) => c.id === 'g_n')!;
    const G = PHYSICAL_CONSTANTS.find((c) => c.id === 'G')!;
    const withG = addPhysicalConstant(addPhysicalConstant(doc, gN), G);
    expect(withG.constants?.[0].symbol).toBe('g_n');
    expect(withG.inputs.at(-1)?.distribution).toEqual({ kind: 'normal', value: G.value, u: G.standardUncertainty });
    const r = computeBudget({ ...withG, model: 'F = m * g_n' }, { monteCarlo: false });
    expect(r.gum.estimate).toBeCloseTo(2 * 9.80665, 12);
  });
});
