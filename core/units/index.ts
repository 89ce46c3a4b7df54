export * from './quantity';
export * from './mass';
export * from './volume';
export * from './time';
export * from './concentration';
export * from './liverIron';
export * from './displayUnit';
export * from './unitSpellings';
