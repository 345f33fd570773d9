import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

/** A message the local SMTP sink really received (dev and tests only). */
export class OutgoingMail extends Model<InferAttributes<OutgoingMail>, InferCreationAttributes<OutgoingMail>> {
  declare id: CreationOptional<number>
  declare to: string
  declare subject: string
  declare text: string
  declare html: string | null
  declare receivedAt: CreationOptional<Date>
  declare via: string

  static initModel(sequelize: Sequelize): void {
    OutgoingMail.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        to: { type: DataTypes.TEXT, allowNull: false },
        subject: { type: DataTypes.TEXT, allowNull: false },
        text: { type: DataTypes.TEXT, allowNull: false },
        html: { type: DataTypes.TEXT, allowNull: true },
        receivedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        via: { type: DataTypes.TEXT, allowNull: false },
      },
      { sequelize, tableName: 'outgoing_mail', underscored: true, timestamps: false },
    )
  }
}
