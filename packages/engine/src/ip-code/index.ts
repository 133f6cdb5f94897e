export * from './ip-code';
export * from './installation-location';
