export * from './catalogue';
export * from './resolve';
