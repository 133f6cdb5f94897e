export * from './integer-math';
export * from './allocate';
export * from './quantity';
export * from './rates';
export * from './vat';
export * from './format';
export * from './quote-totals';
