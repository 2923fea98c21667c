export * from './db';
export * from './builders/user';
export * from './builders/fleet';
export * from './builders/vendor';
export * from './builders/permit';
export * from './scenarios/demo';
