export * from './substanceForms';
export * from './saltToBase';
export * from './catalogue';
export * from './bindingCapacity';
export * from './expectedExcretion';
export * from './deferasiroxFormulation';
export * from './deferoxamineTherapeuticIndex';
export * from './formulas';
