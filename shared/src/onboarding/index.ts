export * from './share-code';
export * from './monitor-example';
