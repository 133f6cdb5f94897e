export * from './engine-input-error';
export * from './length';
export * from './round';
