export * from './shops';
export * from './members';
export * from './customers';
export * from './jobs';
