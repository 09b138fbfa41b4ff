// The role matrix of DESIGN.md, written once. Every handler and page asks `can`.
export const roles = ['host', 'shop_hand', 'editor'] as const;
export type Role = (typeof roles)[number];

export const roleLabels: Record<Role, string> = {
  host: 'Host',
  shop_hand: 'Shop hand',
  editor: 'Editor',
};

export const capabilities = [
  'crew.manage',
  'channel.settings',
  'episodes.edit',
  'scripts.write',
  'scripts.read',
  'shots.edit',
  'shots.editAssigned',
  'shots.changeState',
  'safety.review',
  'cutlist.edit',
  'cutlist.read',
  'clips.upload',
  'clips.read',
  'clips.delete',
  'clips.deleteOwn',
  'sponsors.manage',
  'sponsors.readDisclosure',
  'handoff.lock',
  'handoff.read',
  'editNotes.edit',
  'crew.read',
] as const;
export type Capability = (typeof capabilities)[number];

const matrix: Record<Capability, readonly Role[]> = {
  'crew.manage': ['host'],
  'channel.settings': ['host'],
  'episodes.edit': ['host'],
  'scripts.write': ['host'],
  'scripts.read': ['host', 'shop_hand', 'editor'],
  'shots.edit': ['host'],
  'shots.editAssigned': ['host', 'shop_hand'],
  'shots.changeState': ['host', 'shop_hand'],
  'safety.review': ['host'],
  'cutlist.edit': ['host', 'shop_hand'],
  'cutlist.read': ['host', 'shop_hand', 'editor'],
  'clips.upload': ['host', 'shop_hand'],
  'clips.read': ['host', 'shop_hand', 'editor'],
  'clips.delete': ['host'],
  'clips.deleteOwn': ['host', 'shop_hand'],
  'sponsors.manage': ['host'],
  'sponsors.readDisclosure': ['host', 'editor'],
  'handoff.lock': ['host'],
  // A handoff carries the sponsor read's talking points and disclosure, which a Shop hand does not read.
  'handoff.read': ['host', 'editor'],
  'editNotes.edit': ['host', 'editor'],
  'crew.read': ['host', 'shop_hand', 'editor'],
};

export function can(role: Role, capability: Capability): boolean {
  return matrix[capability].includes(role);
}

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (roles as readonly string[]).includes(value);
}

/** The roles that hold a capability, in the matrix's order (for "this page is for the Host"). */
export function rolesWith(capability: Capability): readonly Role[] {
  return roles.filter((r) => matrix[capability].includes(r));
}
