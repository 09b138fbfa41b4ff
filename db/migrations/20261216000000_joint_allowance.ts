import type { Knex } from 'knex';

/** Rip planning: the width a jointed edge loses per rip, a channel shop setting like the kerf. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('cut_settings', (t) => {
    // Common practice, no published source: rip about 1/16" over and joint the sawn edge straight.
    t.double('joint_in').notNullable().defaultTo(0.0625);
  });
  await knex.raw('alter table cut_settings add constraint cut_settings_joint_range check (joint_in between 0 and 1)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('alter table cut_settings drop constraint if exists cut_settings_joint_range');
  await knex.schema.alterTable('cut_settings', (t) => {
    t.dropColumn('joint_in');
  });
}
