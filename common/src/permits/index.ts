export * from './file-by';
export * from './permit-rules';
