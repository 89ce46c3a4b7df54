export * from './catalogue';
export * from './resolve';
export * from './origin';
