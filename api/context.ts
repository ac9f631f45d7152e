import type { Sequelize } from 'sequelize';
import type { AppConfig } from './config';

/** What every router is built from: the database and the settings, nothing global. */
export interface AppContext {
  sequelize: Sequelize;
  config: AppConfig;
}
