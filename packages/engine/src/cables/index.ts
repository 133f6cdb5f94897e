export * from './tables';
export * from './awg';
export * from './cable-spec';
