export * from './isoDate';
