export * from './blank-record';
export * from './coverage';
export * from './data-index';
export * from './rule-checks';
