import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { loadConfig } from './config';
import { dataSourceOptions } from './db/options';

/** The one data source, used by the server and the TypeORM CLI. */
export const AppDataSource = new DataSource(dataSourceOptions(loadConfig().databaseUrl));
