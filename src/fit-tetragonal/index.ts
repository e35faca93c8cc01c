/** The fit beyond the cubic field: tetragonal Dq, Ds, Dt (and B, ζ) from band maxima. */
export { fitTetragonal, type TetragonalFitInput, type TetragonalFitResult, type TetragonalAssignment, type ParentComponents } from './fit-tetragonal.js';
export { tetragonalFitReport } from './report.js';
