// The version of the engine's numbers. Bump it whenever the same model, seed, sampling and block
// size give other results (a change of sampling, correlation, roll-up or statistics): every run
// stores it, so a stored run is never recomputed by a different engine without saying so.
export const ENGINE_VERSION = '2.0.0';
