import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { Unit } from './Unit'

import type { MeteringDevice, Stage as StageName } from '#shared/types/diagnosis'

/** One refrigeration circuit of a unit with its nameplate data. */
export class UnitStage extends Model<InferAttributes<UnitStage>, InferCreationAttributes<UnitStage>> {
  declare id: CreationOptional<number>
  declare unitId: ForeignKey<Unit['id']>
  declare stage: StageName
  declare refrigerant: string
  declare chargeG: number | null
  declare volumeL: number | null
  declare referenceStandingPressureKpa: number | null
  declare referenceAmbientC: number | null
  declare ratedCurrentA: number | null
  declare designPressureKpa: CreationOptional<number | null>
  declare meteringDevice: CreationOptional<MeteringDevice | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    UnitStage.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        stage: { type: DataTypes.STRING(10), allowNull: false },
        refrigerant: { type: DataTypes.STRING(12), allowNull: false },
        chargeG: { type: DataTypes.DOUBLE, allowNull: true },
        volumeL: { type: DataTypes.DOUBLE, allowNull: true },
        referenceStandingPressureKpa: { type: DataTypes.DOUBLE, allowNull: true },
        referenceAmbientC: { type: DataTypes.DOUBLE, allowNull: true },
        ratedCurrentA: { type: DataTypes.DOUBLE, allowNull: true },
        designPressureKpa: { type: DataTypes.DOUBLE, allowNull: true },
        meteringDevice: { type: DataTypes.STRING(20), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'unit_stages', underscored: true },
    )
  }
}
