/** Engine version stored with every run; bump when any number a run produces could change. */
export const ENGINE_VERSION = '0.1.2';
