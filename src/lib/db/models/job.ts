import 'server-only';
import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { JOB_STATES, type JobState } from '@/lib/jobs/states';

/** A deposit-paid quote once it is booked into the workshop. No row yet means "not booked". */
export class Job extends Model<InferAttributes<Job>, InferCreationAttributes<Job>> {
  declare id: CreationOptional<number>;
  declare quoteId: ForeignKey<number>;
  declare state: CreationOptional<JobState>;
  declare bookedFor: string;
  declare bay: number | null;
  declare technicianUserId: ForeignKey<number> | null;
  declare stateChangedAt: CreationOptional<Date>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Job.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        // Declared (not only through the association) so the unique quote link is written on create.
        quoteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, unique: true },
        state: { type: DataTypes.ENUM(...JOB_STATES), allowNull: false, defaultValue: 'booked' },
        bookedFor: { type: DataTypes.DATEONLY, allowNull: false },
        bay: { type: DataTypes.TINYINT.UNSIGNED, allowNull: true },
        technicianUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        stateChangedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Job', tableName: 'jobs', underscored: true, version: true },
    );
  }
}

/** What the technician measured before first start. Kept per check; the newest row counts. */
export class JobSignOff extends Model<InferAttributes<JobSignOff>, InferCreationAttributes<JobSignOff>> {
  declare id: CreationOptional<number>;
  declare jobId: ForeignKey<number>;
  declare ptvIntakeIn: number;
  declare ptvExhaustIn: number;
  declare springInstalledHeightIn: number;
  declare springSeatPressureLb: number;
  declare coilBindMarginIn: number;
  declare pushrodLengthIn: number;
  declare lifterPreloadIn: number;
  declare deactivationDeleteDone: boolean | null;
  declare tuneFile: string;
  declare notes: string | null;
  declare signedByUserId: ForeignKey<number> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    // Fresh objects per attribute: Sequelize writes the column name into each definition it is given.
    const measured = () => ({ type: DataTypes.DOUBLE, allowNull: false });
    JobSignOff.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        jobId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        ptvIntakeIn: measured(),
        ptvExhaustIn: measured(),
        springInstalledHeightIn: measured(),
        springSeatPressureLb: measured(),
        coilBindMarginIn: measured(),
        pushrodLengthIn: measured(),
        lifterPreloadIn: measured(),
        deactivationDeleteDone: { type: DataTypes.BOOLEAN, allowNull: true },
        tuneFile: { type: DataTypes.STRING(120), allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: true },
        signedByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'JobSignOff', tableName: 'job_sign_offs', underscored: true },
    );
  }
}
