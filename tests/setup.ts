// Property-based tests run from a fixed seed so that a CI run is reproducible; set FC_SEED to explore others.
import fc from "fast-check";

fc.configureGlobal({ seed: Number(process.env.FC_SEED ?? 20261202) });
