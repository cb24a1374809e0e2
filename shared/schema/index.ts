export * from './stack.ts';
export * from './ops.ts';
export * from './errors.ts';
export * from './results.ts';
export * from './api.ts';
export * from './socket.ts';
export * from './stackPositions.ts';
