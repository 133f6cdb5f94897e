export * from './pick-list';
