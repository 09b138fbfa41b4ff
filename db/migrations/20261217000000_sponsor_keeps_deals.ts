import type { Knex } from 'knex';

// Deleting a sponsor must never take its deals with it (issue 13: "delete when it has no deals"). The
// app checks first; this makes the database refuse too, so a deal created at the same moment as the
// delete cannot vanish by cascade. NO ACTION (not RESTRICT) is checked at the end of the statement,
// so deleting a whole channel, which cascades to both tables at once, still works.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`alter table sponsor_deals
    drop constraint sponsor_deals_sponsor_id_foreign,
    add constraint sponsor_deals_sponsor_id_foreign foreign key (sponsor_id) references sponsors(id) on delete no action`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`alter table sponsor_deals
    drop constraint sponsor_deals_sponsor_id_foreign,
    add constraint sponsor_deals_sponsor_id_foreign foreign key (sponsor_id) references sponsors(id) on delete cascade`);
}
