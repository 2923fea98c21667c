export * from './db';
export * from './builders/user';
export * from './builders/fleet';
export * from './builders/vendor';
export * from './scenarios/demo';
