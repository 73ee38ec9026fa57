import {
  ConstantNodeDependencies,
  OperatorNodeDependencies,
  ParenthesisNodeDependencies,
  SymbolNodeDependencies,
  create as createNumberMath,
  derivativeDependencies,
  parseDependencies,
} from 'mathjs/number';
import {
  absDependencies,
  acosDependencies,
  addDependencies,
  asinDependencies,
  atan2Dependencies,
  atanDependencies,
  cosDependencies,
  create,
  createUnitDependencies,
  divideDependencies,
  eDependencies,
  evaluateDependencies,
  expDependencies,
  log10Dependencies,
  logDependencies,
  maxDependencies,
  minDependencies,
  multiplyDependencies,
  piDependencies,
  powDependencies,
  sinDependencies,
  sqrtDependencies,
  subtractDependencies,
  tanDependencies,
  unaryMinusDependencies,
  unaryPlusDependencies,
  unitDependencies,
  type MathJsInstance,
  type ConstantNode as MathConstantNode,
  type OperatorNode as MathOperatorNode,
  type ParenthesisNode as MathParenthesisNode,
  type SymbolNode as MathSymbolNode,
} from 'mathjs';

/**
 * The parts of mathjs the engine uses, built with `create()` from their
 * factories alone: loading the whole library costs the command line and the
 * browser most of their start-up, and a bundler leaves out every factory not
 * named here.
 */

/**
 * Parsing of model lines, the expression nodes, and symbolic derivatives,
 * from the number-only factories (`mathjs/number`): a model holds numbers
 * only, and these skip the BigNumber, fraction, complex and matrix
 * signatures whose making is most of mathjs's start-up.
 */
const math: MathJsInstance = createNumberMath({
  parseDependencies,
  derivativeDependencies,
  ConstantNodeDependencies,
  OperatorNodeDependencies,
  ParenthesisNodeDependencies,
  SymbolNodeDependencies,
});

export const { parse, derivative, ConstantNode, OperatorNode, ParenthesisNode, SymbolNode } = math;
// the node classes are types too, as where they come from in mathjs
export type ConstantNode = MathConstantNode;
export type OperatorNode = MathOperatorNode;
export type ParenthesisNode = MathParenthesisNode;
export type SymbolNode = MathSymbolNode;

/**
 * A new instance for evaluating a model on units (`withBudgetUnits` changes
 * its units, so it is one of its own): units, and the evaluation of a model on unit quantities
 * with every operator and function of the model whitelist (`sandbox.ts`)
 * and the symbols pi and e.
 */
export function createUnitMath(): MathJsInstance {
  return create({
    unitDependencies,
    createUnitDependencies,
    evaluateDependencies,
    addDependencies,
    subtractDependencies,
    multiplyDependencies,
    divideDependencies,
    unaryMinusDependencies,
    unaryPlusDependencies,
    powDependencies,
    sqrtDependencies,
    expDependencies,
    logDependencies,
    log10Dependencies,
    sinDependencies,
    cosDependencies,
    tanDependencies,
    asinDependencies,
    acosDependencies,
    atanDependencies,
    atan2Dependencies,
    absDependencies,
    minDependencies,
    maxDependencies,
    piDependencies,
    eDependencies,
  });
}
