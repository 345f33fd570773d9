export * from './studentT.js'
export * from './median.js'
export * from './fastLog10.js'
