import type { Knex } from 'knex';

// Issue 12: parallel edits could leave an episode's shoot date after its publish date; the rule the
// episode route checks is also the database's. NOT VALID: a row the old race already crossed keeps its
// dates (nothing is rewritten behind the Host's back) until its dates are next edited; every new write is checked.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    alter table episodes add constraint episodes_shoot_not_after_publish
      check (shoot_date is null or publish_date is null or shoot_date <= publish_date) not valid
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('alter table episodes drop constraint if exists episodes_shoot_not_after_publish');
}
