export * from './types';
export * from './derivation';
export * from './validate';
export * from './run';
export * from './describe';
