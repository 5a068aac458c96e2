import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { JobState } from '#shared/types/jobs'

/** Rimecase's record of one background job: whose it is, its state and progress, and its result. pg-boss carries the work. */
export class BackgroundJob extends Model<InferAttributes<BackgroundJob>, InferCreationAttributes<BackgroundJob>> {
  declare id: string
  declare organisationId: number
  declare kind: string
  declare state: CreationOptional<JobState>
  declare progress: CreationOptional<number>
  declare result: unknown | null
  declare error: string | null
  declare attempts: CreationOptional<number>
  declare createdBy: number | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
  declare startedAt: Date | null
  declare finishedAt: Date | null

  static initModel(sequelize: Sequelize) {
    BackgroundJob.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        organisationId: { type: DataTypes.INTEGER, allowNull: false },
        kind: { type: DataTypes.STRING(60), allowNull: false },
        state: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'queued' },
        progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
        result: { type: DataTypes.JSONB, allowNull: true },
        error: { type: DataTypes.TEXT, allowNull: true },
        attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdBy: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
        startedAt: { type: DataTypes.DATE, allowNull: true },
        finishedAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'background_jobs', underscored: true },
    )
  }
}
