export * from './cv-types';
export * from './parallel-run';
