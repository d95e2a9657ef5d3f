/**
 * Every property test runs on a fixed seed, so CI sees the same cases each
 * time; a test that names its own seed keeps it. Set PENUMBRA_FC_SEED to
 * explore other cases locally (a failure prints the seed and path to replay).
 */
import fc from 'fast-check';

const fromEnv = Number(process.env.PENUMBRA_FC_SEED);
fc.configureGlobal({ seed: Number.isInteger(fromEnv) ? fromEnv : 20261203 });
