export * from './code-profile';
