// Property-based tests explore new random cases on every local run; in CI they replay a fixed seed so a
// run that passed once passes again (set FC_SEED to reproduce or vary it).
import fc from 'fast-check';

const seed = process.env.FC_SEED ? Number(process.env.FC_SEED) : process.env.CI ? 20261201 : undefined;
if (seed !== undefined) fc.configureGlobal({ seed });
