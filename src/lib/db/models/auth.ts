import 'server-only';
import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

// Models for the sign-in tables (migration 20261202000200-auth); bound with the others in ./index.ts.

export class StaffSession extends Model<InferAttributes<StaffSession>, InferCreationAttributes<StaffSession>> {
  declare id: CreationOptional<number>;
  declare tokenHash: string;
  declare userId: number;
  declare ip: string | null;
  declare userAgent: string | null;
  declare createdAt: CreationOptional<Date>;
  declare lastSeenAt: CreationOptional<Date>;
  declare expiresAt: Date;
  declare revokedAt: Date | null;

  static initModel(sequelize: Sequelize) {
    StaffSession.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        ip: { type: DataTypes.STRING(64), allowNull: true },
        userAgent: { type: DataTypes.STRING(255), allowNull: true },
        createdAt: DataTypes.DATE,
        lastSeenAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, modelName: 'StaffSession', tableName: 'staff_sessions', underscored: true, updatedAt: false },
    );
  }
}

export const TOKEN_PURPOSES = ['reset', 'invite'] as const;
export type TokenPurpose = (typeof TOKEN_PURPOSES)[number];

export class PasswordToken extends Model<InferAttributes<PasswordToken>, InferCreationAttributes<PasswordToken>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare tokenHash: string;
  declare purpose: TokenPurpose;
  declare expiresAt: Date;
  declare usedAt: Date | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PasswordToken.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        purpose: { type: DataTypes.ENUM(...TOKEN_PURPOSES), allowNull: false },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        usedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      {
        sequelize,
        modelName: 'PasswordToken',
        tableName: 'password_reset_tokens',
        underscored: true,
        updatedAt: false,
      },
    );
  }
}

export class SignInAttempt extends Model<InferAttributes<SignInAttempt>, InferCreationAttributes<SignInAttempt>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare ip: string;
  declare succeeded: boolean;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SignInAttempt.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false },
        ip: { type: DataTypes.STRING(64), allowNull: false },
        succeeded: { type: DataTypes.BOOLEAN, allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: 'SignInAttempt', tableName: 'sign_in_attempts', underscored: true, updatedAt: false },
    );
  }
}
