// Property tests explore new cases on every local run; CI uses one fixed seed so that a landing is repeatable.
// A failure prints its seed: rerun it with FC_SEED=<seed>.
import * as fc from 'fast-check';

const seed = process.env['FC_SEED'] ?? (process.env['CI'] ? '20261202' : undefined);
if (seed !== undefined) fc.configureGlobal({ seed: Number(seed) });
