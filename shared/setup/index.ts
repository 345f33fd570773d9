export * from './beamwidth.js'
export * from './derive.js'
