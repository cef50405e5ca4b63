export * from './matrix';
export * from './region';
export * from './formatFixed';
