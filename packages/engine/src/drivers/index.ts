export * from './driver-choice';
export * from './split-run';
export * from './drive-current-what-if';
