export * from './studentT.js'
export * from './median.js'
