export * from './problem';
export * from './health';
export * from './auth';
export * from './organization';
export * from './estimate';
