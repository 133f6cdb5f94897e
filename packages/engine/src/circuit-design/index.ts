export * from './design-types';
export * from './evaluate-circuit';
export * from './circuit-materials';
export * from './circuit-suggestions';
export * from './cable-suggestion';
export * from './drive-current-options';
