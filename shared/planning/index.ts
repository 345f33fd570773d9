export * from './powerLimits.js'
export * from './linkPlan.js'
