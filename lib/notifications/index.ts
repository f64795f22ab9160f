export * from './kinds';
export * from './preferences';
export * from './recipients';
export * from './render';
