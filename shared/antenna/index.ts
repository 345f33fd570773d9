export * from './pattern.js'
export * from './beamwidth.js'
