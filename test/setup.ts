// Property tests run with a fixed seed so that CI is repeatable; FC_SEED=random explores new cases.
import fc from 'fast-check';

const seed = process.env.FC_SEED;
if (seed !== 'random') fc.configureGlobal({ seed: seed ? Number(seed) : 20261202 });
