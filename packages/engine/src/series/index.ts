export * from './series-types';
export * from './fitting-drive';
export * from './series-string';
