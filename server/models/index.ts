import type { Sequelize } from 'sequelize'

/** Initialises every model and its associations; each feature adds its init call here. */
export function initModels(sequelize: Sequelize): void {
  void sequelize
}
