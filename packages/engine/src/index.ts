/**
 * @gloaming/engine public API. Pure TypeScript: no I/O, no framework, deterministic,
 * JSON-serialisable inputs and outputs. Each module is re-exported here.
 */
export * from './findings';
// -- cables, units, IP code, code profiles, series strings, driver choice (section A)
export * from './units';
export * from './cables';
// -- connector blocks, terminal schedule, wiring check (section B)
// -- constant-voltage runs, takeoff, labour, money (section C)
