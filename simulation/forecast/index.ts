/** The forecast's public face: callers import from here (simulation/forecast). */
export * from './session';
