export * from './db';
export * from './builders/user';
export * from './scenarios/demo';
export * from './builders/fleet';
