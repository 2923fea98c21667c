export * from './db';
export * from './builders/user';
export * from './builders/fleet';
export * from './scenarios/demo';
