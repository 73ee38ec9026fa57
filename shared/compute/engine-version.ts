/** Stored with every computed version, so a result can be traced to the engine that produced it. */
export const ENGINE_VERSION = 'dubito-engine/0.1.0';
