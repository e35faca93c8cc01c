/**
 * The ligand-field fit's least squares: the one solver of fieldgap
 * (src/numeric/least-squares.ts), re-exported under its old path.
 */
export {
  leastSquares, leastSquaresNormal, forwardDifferenceJacobian, LEAST_SQUARES_MESSAGES, leastSquaresSuccess,
  type JacobianFunction, type LeastSquaresOptions, type LeastSquaresResult, type LeastSquaresStatus, type ResidualFunction,
} from '../numeric/least-squares.js';
