/** Stored with every computed version, so a result can be traced to the engine that produced it. */
// 0.2.0: normal draws by the ziggurat, so a seed gives other Monte Carlo numbers than 0.1.0.
export const ENGINE_VERSION = 'dubito-engine/0.2.0';
