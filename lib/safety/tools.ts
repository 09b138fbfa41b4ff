// The shop tools a segment can list, and the usual cautions each brings.
// Common practice, no published source: these are the cautions shop classes and tool manuals
// repeat; they never replace the tool maker's manual, local codes or licensed practice.
export const tools = [
  'table_saw',
  'dado_stack',
  'router',
  'jointer',
  'planer',
  'bandsaw',
  'miter_saw',
  'circular_saw',
  'drill_driver',
  'chisels',
  'sander',
  'finishes',
  'other',
] as const;
export type Tool = (typeof tools)[number];

type ToolInfo = { label: string; power: boolean; cautions: string[] };

const protection = 'Eye and hearing protection on.';
const dust = 'Dust collection running; wear a dust mask or respirator for fine dust.';

export const toolInfo: Record<Tool, ToolInfo> = {
  table_saw: {
    label: 'Table saw',
    power: true,
    cautions: [protection, 'Blade guard and riving knife in place.', 'Push stick or push block for narrow rips; stand out of the kickback line.', 'No gloves, loose sleeves or jewellery near the blade.'],
  },
  dado_stack: {
    label: 'Dado stack',
    power: true,
    cautions: [protection, 'Only on a saw whose maker allows a dado stack, with the matching throat plate.', 'Push blocks and featherboards; never cut a dado freehand.'],
  },
  router: {
    label: 'Router',
    power: true,
    cautions: [protection, 'Workpiece clamped or held by a jig; feed against the bit’s rotation.', 'Unplug before changing bits.', dust],
  },
  jointer: {
    label: 'Jointer',
    power: true,
    cautions: [protection, 'Guard in place; push blocks, hands never over the cutterhead.', 'Respect the maker’s minimum length and thickness.'],
  },
  planer: {
    label: 'Planer',
    power: true,
    cautions: [protection, 'Respect the maker’s minimum length; stand to the side of the infeed.', dust],
  },
  bandsaw: {
    label: 'Bandsaw',
    power: true,
    cautions: [protection, 'Upper guard set just above the work.', 'Push stick when fingers come near the blade; round stock held in a jig.'],
  },
  miter_saw: {
    label: 'Miter saw',
    power: true,
    cautions: [protection, 'Work held against the fence or clamped; hands outside the marked no-hands zone.', 'Let the blade stop before lifting it.'],
  },
  circular_saw: {
    label: 'Circular or track saw',
    power: true,
    cautions: [protection, 'Support both sides of the cut so the kerf cannot pinch; track or guide clamped.', 'Lower guard working; cord clear of the cut.'],
  },
  drill_driver: {
    label: 'Drill/driver',
    power: true,
    cautions: ['Eye protection on.', 'Clamp the work; remove the battery or unplug to change bits.'],
  },
  chisels: {
    label: 'Chisels',
    power: false,
    cautions: ['Keep the edge sharp and both hands behind it; cut away from your body.', 'Work held in a vise or clamped.'],
  },
  sander: {
    label: 'Sander',
    power: true,
    cautions: ['Hearing protection on.', dust],
  },
  finishes: {
    label: 'Finishes and solvents',
    power: false,
    cautions: [
      'Ventilate; gloves and a respirator as the product’s safety data sheet says.',
      'No flames or sparks near solvents.',
      'Oily rags can heat up and catch fire on their own: dry them flat outdoors or keep them in a sealed metal can of water.',
    ],
  },
  other: {
    label: 'Other',
    power: true,
    cautions: ['Read the tool maker’s manual before filming; set guards and protection it calls for.'],
  },
};

export const SAFETY_DEFERENCE =
  'These are the usual cautions only. The tool maker’s manual, local codes and licensed practice come first.';

/** "Other" counts as a power tool: an unknown tool is reviewed rather than assumed safe. */
export const needsSafetyReview = (list: readonly Tool[]): boolean => list.some((t) => toolInfo[t].power);

/** Each caution once, in tool order, for a segment's list. */
export function cautionsFor(list: readonly Tool[]): { tool: Tool; label: string; cautions: string[] }[] {
  const seen = new Set<string>();
  return tools
    .filter((t) => list.includes(t))
    .map((t) => {
      const cautions = toolInfo[t].cautions.filter((c) => !seen.has(c));
      cautions.forEach((c) => seen.add(c));
      return { tool: t, label: toolInfo[t].label, cautions };
    });
}
