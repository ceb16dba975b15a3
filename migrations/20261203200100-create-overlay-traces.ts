/**
 * overlay_traces: the spectra of an overlay in plot order (`position` 0, 1, …; the colour follows
 * the position). A trace goes with its overlay and with its analysis (deleting a capture removes its
 * traces from every overlay).
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

const ID = 'char(24) character set ascii collate ascii_bin';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('overlay_traces', (t) => {
    t.engine('InnoDB');
    t.specificType('overlay_id', ID).notNullable();
    t.integer('position').unsigned().notNullable();
    t.specificType('analysis_id', ID).notNullable();
    t.primary(['overlay_id', 'position']);
    t.unique(['overlay_id', 'analysis_id'], { indexName: 'overlay_traces_analysis_unique' });
    t.index(['analysis_id'], 'overlay_traces_analysis_idx');
    t.foreign('overlay_id', 'overlay_traces_overlay_fk').references('overlays.id').onDelete('CASCADE');
    t.foreign('analysis_id', 'overlay_traces_analysis_fk').references('analyses.id').onDelete('CASCADE');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('overlay_traces');
}
