import type { Capability } from './policy';

/**
 * The capability each channel page asks of its viewer, written once: the pages pass it to
 * requireMember, and the not-allowed page reads it back from the address to say which role is needed.
 * Paths are relative to /c/[channel]; a page missing here needs only membership.
 */
export const pageAccess = {
  newEpisode: { path: /^\/episodes\/new$/, capability: 'episodes.edit' },
  editEpisode: { path: /^\/episodes\/[^/]+\/edit$/, capability: 'episodes.edit' },
  cutPlan: { path: /^\/episodes\/[^/]+\/cut-plan$/, capability: 'cutlist.read' },
  handoff: { path: /^\/episodes\/[^/]+\/handoff\/[^/]+$/, capability: 'handoff.read' },
  stockRack: { path: /^\/stock$/, capability: 'cutlist.read' },
  sponsors: { path: /^\/sponsors$/, capability: 'sponsors.readDisclosure' },
  sponsorDeal: { path: /^\/sponsors\/[^/]+$/, capability: 'sponsors.manage' },
  crew: { path: /^\/settings\/crew$/, capability: 'crew.manage' },
} as const satisfies Record<string, { path: RegExp; capability: Capability }>;

/** The capability the page at this address asks for, or null for a page open to all crew or not a channel page. */
export function pageCapability(pathname: string): Capability | null {
  const m = pathname.match(/^\/c\/[^/]+(\/.*)?$/);
  if (!m) return null;
  const rest = (m[1] ?? '').replace(/\/$/, '');
  for (const rule of Object.values(pageAccess)) if (rule.path.test(rest)) return rule.capability;
  return null;
}
