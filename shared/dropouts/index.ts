export * from './detect.js'
export * from './classify.js'
