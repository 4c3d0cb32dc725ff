/** Version of the physics engine; part of every run's input hash, bumped when numbers may change. */
export const ENGINE_VERSION = '0.1.0'
