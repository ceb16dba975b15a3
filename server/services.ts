/**
 * The services of the app, built from a Knex instance. createApp() uses them behind the routes; the
 * demo seed uses them directly so that it follows the same rules.
 */
import type { Knex } from 'knex';
import { createAuthService } from './modules/auth/auth.service';
import { createBenchesService } from './modules/benches/benches.service';
import { createLasersService } from './modules/lasers/lasers.service';
import { createMembersService } from './modules/members/members.service';

export function createServices(db: Knex) {
  return {
    auth: createAuthService(db),
    benches: createBenchesService(db),
    members: createMembersService(db),
    lasers: createLasersService(db),
  };
}

export type Services = ReturnType<typeof createServices>;
