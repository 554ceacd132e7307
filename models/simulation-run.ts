import 'server-only';
import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
} from 'sequelize';
import { sequelize } from '@/lib/db/sequelize';
import type { RunSettings } from '@/lib/validation/runs';
import type { Organization } from './organization';
import type { Project } from './project';
import type { User } from './user';

export const RUN_STATUSES = ['queued', 'running', 'succeeded', 'failed', 'cancelled'] as const;
export type RunStatus = (typeof RUN_STATUSES)[number];

/** The first and the latest progress report of a running run, for the time left. */
export type ProgressMarks = { first: { at: number; done: number }; latest: { at: number; done: number } };

/** The headline figures of a finished run, kept apart from the (large) result. */
export type RunSummary = {
  iterations: number;
  currency: string | null;
  cost: { base: number; P50: number; P80: number; P90: number };
  duration: { base: number; P50: number; P80: number; P90: number } | null;
};

/**
 * One simulation run. `inputSnapshot` (the model file it ran on, canonical JSON) and `result`
 * (the engine's result file) are kept as text: they are large and read whole, never queried.
 */
export class SimulationRun extends Model<
  InferAttributes<SimulationRun>,
  InferCreationAttributes<SimulationRun>
> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization['id']>;
  declare projectId: ForeignKey<Project['id']>;
  /** The run's number within its project: Run 1 is the project's first run. */
  declare number: CreationOptional<number>;
  declare startedById: ForeignKey<User['id']> | null;
  declare status: CreationOptional<RunStatus>;
  declare settings: RunSettings;
  declare progress: CreationOptional<number>;
  declare iterationsDone: CreationOptional<number>;
  declare failureReason: CreationOptional<string | null>;
  declare inputSnapshot: string;
  declare inputHash: string;
  declare result: CreationOptional<string | null>;
  declare resultSample: CreationOptional<string | null>;
  declare summary: CreationOptional<RunSummary | null>;
  /** The engine version and block size the run was computed with (null for older runs). */
  declare engineVersion: CreationOptional<string | null>;
  /** What the registers → model export left out or changed (closed risks, their correlations…). */
  declare modelNotices: CreationOptional<string[] | null>;
  declare blockSize: CreationOptional<number | null>;
  /** The claim of the attempt executing the run; its writes require the row to still name it. */
  declare attemptToken: CreationOptional<string | null>;
  /** How many times the run was started (a run whose worker died is started again). */
  declare attempts: CreationOptional<number>;
  declare progressMarks: CreationOptional<ProgressMarks | null>;
  declare startedAt: CreationOptional<Date | null>;
  declare finishedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

SimulationRun.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    organizationId: { type: DataTypes.INTEGER, allowNull: false },
    projectId: { type: DataTypes.INTEGER, allowNull: false },
    number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    startedById: { type: DataTypes.INTEGER, allowNull: true },
    status: { type: DataTypes.ENUM(...RUN_STATUSES), allowNull: false, defaultValue: 'queued' },
    settings: { type: DataTypes.JSON, allowNull: false },
    progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    iterationsDone: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    failureReason: { type: DataTypes.TEXT, allowNull: true },
    inputSnapshot: { type: DataTypes.TEXT('long'), allowNull: false },
    inputHash: { type: DataTypes.CHAR(64), allowNull: false },
    result: { type: DataTypes.TEXT('long'), allowNull: true },
    resultSample: { type: DataTypes.TEXT('long'), allowNull: true },
    summary: { type: DataTypes.JSON, allowNull: true },
    engineVersion: { type: DataTypes.STRING(32), allowNull: true },
    modelNotices: { type: DataTypes.JSON, allowNull: true },
    blockSize: { type: DataTypes.INTEGER, allowNull: true },
    attemptToken: { type: DataTypes.CHAR(36), allowNull: true },
    attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    progressMarks: { type: DataTypes.JSON, allowNull: true },
    startedAt: { type: DataTypes.DATE, allowNull: true },
    finishedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'SimulationRuns' },
);
