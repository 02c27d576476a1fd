/**
 * The formula engine of similis: safe parsing, dimension checking, evaluation over columns and
 * derivatives of user formulas such as `Re: rho*U*D/mu` or `where: Re > 4000 and LD >= 20`.
 *
 *   text --parseFormula--> Formula (tree with source columns)
 *        --checkKinds / inferDimension--> checked kind and dimension
 *        --compileFormula--> CompiledFormula --bind(columns)--> BoundFormula (evaluate, Jacobian)
 *        --differentiate--> Formula of the derivative (printable, compilable)
 *
 * Nothing here evaluates user text as code: formulas are tokenised and parsed by hand, and the
 * compiled JavaScript is generated from the checked tree with names replaced by array slots.
 */
export type {
  ArithmeticOp,
  BinaryNode,
  BinaryOp,
  CallNode,
  ComparisonOp,
  ConstNode,
  ExprNode,
  Formula,
  LogicalOp,
  NameNode,
  NumNode,
  Span,
  UnaryNode,
  UnaryOp,
} from './ast.js';
export { binaryNode, callNode, childrenOf, nameNode, nodeText, numNode, piNode, sameTree, SYNTHETIC_SPAN, unaryNode } from './ast.js';
export { FORMULA_ERROR, type FormulaErrorKind } from './errors.js';
export { FORMULA_LIMITS, parseFormula, type FormulaLimits, type ParseOptions } from './parser.js';
export { tokenize, type Token, type TokenType } from './lexer.js';
export { formatFormula } from './format.js';
export { isConstantNode, nameOccurrences, namesIn } from './names.js';
export { evaluateConstant, type ConstantValue } from './constant.js';
export { evaluateAt, evaluateNode } from './evaluate.js';
export {
  BUILTIN_FUNCTIONS,
  dimensionlessRule,
  fixedDimensionRule,
  FunctionTable,
  sameDimensionRule,
  type DimensionRule,
  type DimensionVerdict,
  type FunctionSpec,
  type PartialRule,
} from './functions.js';
export { checkUserName, isReservedName, isValidName, RESERVED_NAMES } from './reserved.js';
export { checkKinds, type FormulaKind } from './kinds.js';
export { inferDimension, type DimensionLookup, type DimensionResult, type InferOptions } from './dimensions.js';
export {
  compileFormula,
  type BoundFormula,
  type CompiledFormula,
  type CompileOptions,
  type FormulaInputs,
  type FormulaLayout,
} from './compile.js';
export { derivativeNode, differentiate } from './derivative.js';
export { simplify } from './simplify.js';
export { dimensionWords } from './messages.js';
