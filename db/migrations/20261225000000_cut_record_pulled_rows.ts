import type { Knex } from 'knex';

/**
 * Taking back a cut record (its "Take back"): the on-hand rows the record pulled, as they were when
 * "Mark these cuts done" locked them (id, size, count, source, episode, cut record, who added it and
 * when), so a row the record used up entirely can be put back with its own id and provenance.
 *
 * Nullable: records made before this column have no copy; taking one of those back re-inserts the
 * pieces it pulled as added by hand (source 'hand', no episode, no record), which
 * on_hand_pieces_hand_has_no_plan accepts.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('cut_records', (t) => {
    t.jsonb('pulled_rows');
  });
  await knex.raw(`alter table cut_records
    add constraint cut_records_pulled_rows_array check (pulled_rows is null or jsonb_typeof(pulled_rows) = 'array')`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('alter table cut_records drop constraint if exists cut_records_pulled_rows_array');
  await knex.schema.alterTable('cut_records', (t) => {
    t.dropColumn('pulled_rows');
  });
}
