export * from './matrix';
export * from './region';
