export * from './circuit';
export * from './catalogue';
export * from './takeoff';
export * from './quote-lines';
