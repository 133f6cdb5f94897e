export * from './engine-input-error';
export * from './length';
