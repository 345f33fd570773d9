export * from './guards.js'
export * from './power.js'
export * from './length.js'
export * from './format.js'
