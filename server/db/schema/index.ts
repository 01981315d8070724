export * from './users';
export * from './catalogue';
export * from './swaps';
export * from './community';
export * from './interchange';
export * from './plans';
export * from './following';
