import 'server-only';
import { db } from '@/db/client';
import { notFound } from '@/lib/errors';
import { stockRow } from './describe';
import { DEFAULT_CUT_SETTINGS, type CreateStockInput, type CutSettingsDto, type CutSettingsInput, type StockItemDto } from './schemas';

type StockRow = {
  id: string;
  kind: StockItemDto['kind'];
  name: string;
  species: string;
  nominal: string;
  thickness_in: number;
  width_in: number | null;
  price_per_bf_cents: number | null;
  offers: StockItemDto['offers'];
};

const stockColumns = ['id', 'kind', 'name', 'species', 'nominal', 'thickness_in', 'width_in', 'price_per_bf_cents', 'offers'];

const toStockDto = (r: StockRow): StockItemDto => ({
  id: r.id,
  kind: r.kind,
  name: r.name,
  species: r.species,
  nominal: r.nominal,
  thicknessIn: r.thickness_in,
  widthIn: r.width_in,
  pricePerBoardFootCents: r.price_per_bf_cents,
  offers: r.offers,
});

const kindOrder = db.raw("array_position(array['softwood','hardwood','sheet']::stock_kind[], kind)");

export async function listStock(channelId: string): Promise<StockItemDto[]> {
  const rows: StockRow[] = await db('stock_items').where({ channel_id: channelId }).orderBy([{ column: kindOrder }, { column: 'name' }]).select(stockColumns);
  return rows.map(toStockDto);
}

export async function createStock(channelId: string, input: CreateStockInput): Promise<StockItemDto> {
  const [row] = await db('stock_items')
    .insert({ channel_id: channelId, ...stockRow(input) })
    .returning<StockRow[]>(stockColumns);
  if (!row) throw new Error('insert returned no row');
  return toStockDto(row);
}

/** Replaces the whole definition: the rack form always sends every field. */
export async function updateStock(channelId: string, stockId: string, input: CreateStockInput): Promise<StockItemDto> {
  const [row] = await db('stock_items')
    .where({ id: stockId, channel_id: channelId })
    .update({ ...stockRow(input), updated_at: db.fn.now() })
    .returning<StockRow[]>(stockColumns);
  if (!row) throw notFound('That stock item');
  return toStockDto(row);
}

export async function deleteStock(channelId: string, stockId: string): Promise<void> {
  const count = await db('stock_items').where({ id: stockId, channel_id: channelId }).delete();
  if (count === 0) throw notFound('That stock item');
}

type SettingsRow = { kerf_in: number; end_trim_in: number; min_offcut_in: number; joint_in: number; length_unit: CutSettingsDto['lengthUnit'] };
const toSettingsDto = (r: SettingsRow): CutSettingsDto => ({
  kerfIn: r.kerf_in,
  endTrimIn: r.end_trim_in,
  minOffcutIn: r.min_offcut_in,
  jointIn: r.joint_in,
  lengthUnit: r.length_unit,
});

export async function getCutSettings(channelId: string): Promise<CutSettingsDto> {
  const row: SettingsRow | undefined = await db('cut_settings').where({ channel_id: channelId }).first('kerf_in', 'end_trim_in', 'min_offcut_in', 'joint_in', 'length_unit');
  return row ? toSettingsDto(row) : DEFAULT_CUT_SETTINGS;
}

const settingsColumns = { kerfIn: 'kerf_in', endTrimIn: 'end_trim_in', minOffcutIn: 'min_offcut_in', jointIn: 'joint_in', lengthUnit: 'length_unit' } as const;

/**
 * One statement that writes only the fields given: a first change inserts the defaults with them,
 * later ones update just those columns. Reading first and writing all four lost parallel changes (issue 12).
 */
export async function updateCutSettings(channelId: string, input: CutSettingsInput): Promise<CutSettingsDto> {
  const given = (Object.keys(settingsColumns) as (keyof typeof settingsColumns)[]).filter((k) => input[k] !== undefined);
  const next = { ...DEFAULT_CUT_SETTINGS, ...Object.fromEntries(given.map((k) => [k, input[k]])) } as CutSettingsDto;
  const [row] = await db('cut_settings')
    .insert({ channel_id: channelId, kerf_in: next.kerfIn, end_trim_in: next.endTrimIn, min_offcut_in: next.minOffcutIn, joint_in: next.jointIn, length_unit: next.lengthUnit })
    .onConflict('channel_id')
    .merge([...given.map((k) => settingsColumns[k]), 'updated_at'])
    .returning<SettingsRow[]>(['kerf_in', 'end_trim_in', 'min_offcut_in', 'joint_in', 'length_unit']);
  if (!row) throw new Error('upsert returned no row');
  return toSettingsDto(row);
}
