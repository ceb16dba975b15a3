import knexFactory, { type Knex } from 'knex';
import { knexConfig } from './knexfile';
import type { Env } from '../config/env';

export type Db = Knex;

export function createDb(env: Env): Db {
  return knexFactory(knexConfig(env));
}
