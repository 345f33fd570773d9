export * from './grid.js'
