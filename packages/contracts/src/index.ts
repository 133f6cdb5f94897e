export * from './problem';
export * from './health';
export * from './auth';
export * from './organization';
export * from './estimate';
export * from './customers';
export * from './catalogue';
export * from './price-list-import';
