export * from './auth/roles';
export * from './moves/stages';
export * from './errors/error-codes';
export * from './validation/limits';
export * from './types/auth';
export * from './engine';
