/**
 * fast-check runs with a fixed seed by default so the suite is reproducible on CI.
 * Set FC_SEED=<integer> to replay a seed, or FC_SEED=random to explore; FC_RUNS raises the run count.
 */
import fc from 'fast-check';

const seedEnv = process.env.FC_SEED;
const seed = seedEnv === 'random' ? Date.now() : seedEnv ? Number(seedEnv) : 20261202;
const numRuns = process.env.FC_RUNS ? Number(process.env.FC_RUNS) : 100;
fc.configureGlobal({ seed, numRuns });
