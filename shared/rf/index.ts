export * from './wavelength.js'
export * from './freeSpaceLoss.js'
export * from './linkBudget.js'
