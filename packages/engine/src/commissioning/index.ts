export * from './commissioning-readings';
