export * from './bounds';
export * from './inputRange';
export * from './plausibleRanges';
