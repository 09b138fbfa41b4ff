import { dressedSize, parseNominalProfile, plywoodActualThickness } from '@/lib/lumber';
import { formatLength } from '@/lib/units';
import type { CreateStockInput, HardwoodOffer, LumberOffer, SheetOffer } from './schemas';

export type StockDefinition = {
  kind: CreateStockInput['kind'];
  name: string;
  species: string;
  nominal: string;
  thicknessIn: number;
  widthIn: number | null;
  pricePerBoardFootCents: number | null;
  offers: (LumberOffer | SheetOffer | HardwoodOffer)[];
};

const inch = (n: number) => formatLength(n, { unit: 'in' });

/** Works out actual sizes and the display name of a stock item from what the user typed. */
export function describeStock(input: CreateStockInput): StockDefinition {
  switch (input.kind) {
    case 'softwood': {
      const size = dressedSize(parseNominalProfile(input.nominal));
      return {
        kind: 'softwood',
        name: `${input.nominal} ${input.species}`,
        species: input.species,
        nominal: input.nominal,
        thicknessIn: size.thickness,
        widthIn: size.width,
        pricePerBoardFootCents: null,
        offers: sortOffers(input.offers.map((o) => ({ lengthIn: o.lengthIn, priceCents: o.price }))),
      };
    }
    case 'hardwood': {
      const widths = [...new Set(input.offers.map((o) => o.widthIn))].sort((a, b) => a - b);
      const narrowest = widths[0] ?? 0;
      const widest = widths[widths.length - 1] ?? 0;
      return {
        kind: 'hardwood',
        // One width reads as before ("4/4 Ash, 6" wide"), so rows saved before issue 16 keep their names.
        name: `${input.nominal} ${input.species}, ${widths.length > 1 ? `${inch(narrowest)} to ${inch(widest)}` : inch(widest)} wide`,
        species: input.species,
        nominal: input.nominal,
        // Hardwood is sold and tallied on its rough thickness in quarters; the shop surfaces it.
        thicknessIn: Number(input.nominal.split('/')[0]) / 4,
        widthIn: widest,
        pricePerBoardFootCents: input.pricePerBoardFoot,
        offers: sortOffers(input.offers.map((o) => ({ widthIn: o.widthIn, lengthIn: o.lengthIn, priceCents: 0 }))),
      };
    }
    case 'sheet': {
      const actual = input.plywood ? plywoodActualThickness(input.nominal) : undefined;
      return {
        kind: 'sheet',
        name: `${inch(input.nominal)} ${input.species}`,
        species: input.species,
        nominal: inch(input.nominal).replace('"', ''),
        thicknessIn: actual ?? input.nominal,
        widthIn: null,
        pricePerBoardFootCents: null,
        offers: sortOffers(input.offers.map((o) => ({ widthIn: o.widthIn, lengthIn: o.lengthIn, priceCents: o.price }))),
      };
    }
  }
}

function sortOffers<T extends { lengthIn: number; widthIn?: number }>(offers: T[]): T[] {
  return [...offers].sort((a, b) => (a.widthIn ?? 0) - (b.widthIn ?? 0) || a.lengthIn - b.lengthIn);
}

/** The stock_items columns for a definition, shared by the rack's queries and the demo seed. */
export function stockRow(input: CreateStockInput) {
  const d = describeStock(input);
  return {
    kind: d.kind,
    name: d.name,
    species: d.species,
    nominal: d.nominal,
    thickness_in: d.thicknessIn,
    width_in: d.widthIn,
    price_per_bf_cents: d.pricePerBoardFootCents,
    offers: JSON.stringify(d.offers),
  };
}
