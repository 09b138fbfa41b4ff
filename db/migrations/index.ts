import type { Knex } from 'knex';
import * as foundation from './20261201000000_foundation';
import * as episodes from './20261201100000_episodes';
import * as cutlist from './20261202000000_cutlist';
import * as shots from './20261202100000_shots';
import * as clips from './20261203000000_clips';
import * as episodeDateOrder from './20261212000000_episode_date_order';
import * as byteRemovals from './20261212000001_byte_removals';
import * as sessionsAndLimits from './20261213000000_sessions_and_limits';
import * as sponsors from './20261214000000_sponsors';
import * as handoffs from './20261215000000_handoffs';
import * as jointAllowance from './20261216000000_joint_allowance';
import * as sponsorKeepsDeals from './20261217000000_sponsor_keeps_deals';
import * as clipCrc32 from './20261218000000_clip_crc32';
import * as clipsSha256Index from './20261219000000_clips_sha256_index';
import * as shoppingBoardTicks from './20261220000000_shopping_board_ticks';
import * as onHandStock from './20261221000000_on_hand_stock';
import * as hardwoodBoardWidths from './20261222000000_hardwood_board_widths';
import * as uploadMarks from './20261223000000_upload_marks';
import * as cutRecordPulledRows from './20261225000000_cut_record_pulled_rows';

type Migration = { up: (knex: Knex) => Promise<void>; down: (knex: Knex) => Promise<void> };

// Listed here rather than read from disk, so the same migrations run under tsx, Vitest and Next alike.
// Add a new migration file and append it below; names sort by their timestamp prefix.
const migrations: Record<string, Migration> = {
  '20261201000000_foundation': foundation,
  '20261201100000_episodes': episodes,
  '20261202000000_cutlist': cutlist,
  '20261202100000_shots': shots,
  '20261203000000_clips': clips,
  '20261212000000_episode_date_order': episodeDateOrder,
  '20261212000001_byte_removals': byteRemovals,
  '20261213000000_sessions_and_limits': sessionsAndLimits,
  '20261214000000_sponsors': sponsors,
  '20261215000000_handoffs': handoffs,
  '20261216000000_joint_allowance': jointAllowance,
  '20261217000000_sponsor_keeps_deals': sponsorKeepsDeals,
  '20261218000000_clip_crc32': clipCrc32,
  '20261219000000_clips_sha256_index': clipsSha256Index,
  '20261220000000_shopping_board_ticks': shoppingBoardTicks,
  '20261221000000_on_hand_stock': onHandStock,
  '20261222000000_hardwood_board_widths': hardwoodBoardWidths,
  '20261223000000_upload_marks': uploadMarks,
  '20261225000000_cut_record_pulled_rows': cutRecordPulledRows,
};

export const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () => Object.keys(migrations).sort(),
  getMigrationName: (name) => name,
  getMigration: async (name) => {
    const migration = migrations[name];
    if (!migration) throw new Error(`Unknown migration ${name}`);
    return migration;
  },
};
