export * from './labour-table';
export * from './labour';
