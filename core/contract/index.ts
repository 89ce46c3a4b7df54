export * from './callNames';
export * from './contract';
export * from './settings';
export * from './previewWire';
