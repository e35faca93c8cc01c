/**
 * src/report: the one writer of each output, shared by the CLI, the service
 * and the page. CSV (csv.ts), text tables (text-table.ts), "±" (plus-minus.ts),
 * the spin-state wording (spin-state-wording.ts), probabilities in words (probability.ts)
 * the per-analysis results table (results-csv.ts) a band's kind by its
 * assignment (band-assigned-kind.ts) and whether a chosen assignment breaks its priors (prior-strain.ts). Pure; no file or network access.
 */
export * from './csv.js';
export * from './text-table.js';
export * from './plus-minus.js';
export * from './spin-state-wording.js';
export * from './results-csv.js';
export * from './probability.js';
export * from './band-assigned-kind.js';
export * from './prior-strain.js';
