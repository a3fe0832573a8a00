// Public surface of the engine. Models (values, tubes, bias, small signal, design format) and
// statistics (spreads, sampling, chunked runs, influence, worst case) keep their own barrels.
export * from './modelsApi.js';
export * from './statsApi.js';
export { ENGINE_VERSION } from './version.js';
export * from './production/index.js';
export * from './values/resistorKinds.js';
