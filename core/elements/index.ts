export * from './atomicWeights';
export * from './molarMass';
