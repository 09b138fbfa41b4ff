import type { Knex } from 'knex';

// The CRC-32 of a clip's bytes, taken at ingest in the same pass as its SHA-256, so the clip package
// (a ZIP, whose records carry each file's CRC-32) streams the bytes without computing it again.
// Null for clips recorded before this column: the package computes theirs while streaming.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('clips', (t) => {
    t.bigInteger('crc32');
  });
  await knex.raw('alter table clips add constraint clips_crc32_range check (crc32 between 0 and 4294967295)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('clips', (t) => {
    t.dropChecks(['clips_crc32_range']);
    t.dropColumn('crc32');
  });
}
