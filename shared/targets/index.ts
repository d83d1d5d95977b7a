export * from './bands'
export * from './read'
export * from './resolve'
export * from './readings'
