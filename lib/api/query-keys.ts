// Every TanStack Query key the client uses, in one place. Keys nest, so invalidating a shorter key
// refreshes everything under it: `queryKeys.shots(slug)` covers a segment's shot list, the shop board,
// "My shots" and shot history, and `queryKeys.runningOrders(slug)` every episode's running order.

export const queryKeys = {
  runningOrders: (slug: string) => ['running-order', slug] as const,
  runningOrder: (slug: string, episodeId: string) => ['running-order', slug, episodeId] as const,

  shots: (slug: string) => ['shots', slug] as const,
  segmentShots: (slug: string, segmentId: string) => ['shots', slug, 'segment', segmentId] as const,
  shotHistory: (slug: string, shotId: string) => ['shots', slug, 'history', shotId] as const,
  shopBoards: (slug: string) => ['shots', slug, 'board'] as const,
  shopBoard: (slug: string, search: string) => ['shots', slug, 'board', search] as const,
  myShots: (slug: string) => ['shots', slug, 'mine'] as const,
  shotMail: (slug: string) => ['shot-mail', slug] as const,

  segmentSafety: (slug: string, segmentId: string) => ['safety', slug, 'segment', segmentId] as const,
  segmentClips: (slug: string, segmentId: string) => ['clips', slug, 'segment', segmentId] as const,

  crew: (slug: string) => ['crew', slug] as const,
  invitations: (slug: string) => ['invitations', slug] as const,

  stock: (slug: string) => ['stock', slug] as const,
  onHand: (slug: string) => ['stock', slug, 'on-hand'] as const,
  parts: (segmentId: string) => ['parts', segmentId] as const,
  /** Every segment's parts list (their cut counts change together when cuts done are taken back). */
  allParts: () => ['parts'] as const,
  handoffs: (slug: string, episodeId: string) => ['handoffs', slug, episodeId] as const,
  versionNotes: (slug: string, episodeId: string, version: number) => ['handoffs', slug, episodeId, version, 'notes'] as const,
  clipNotes: (slug: string, clipId: string) => ['clip-notes', slug, clipId] as const,

  cutPlans: () => ['cut-plan'] as const,
  segmentCutPlan: (segmentId: string) => ['cut-plan', 'segment', segmentId] as const,
  episodeCutPlan: (episodeId: string) => ['cut-plan', 'episode', episodeId] as const,
};

/** Mutation keys, for "is another one of these still in flight?" checks. */
export const mutationKeys = {
  moveSegment: (slug: string, episodeId: string) => ['running-order', slug, episodeId, 'move'] as const,
  moveShot: (slug: string, segmentId: string) => ['shots', slug, 'segment', segmentId, 'move'] as const,
  setShotState: (slug: string) => ['shot-state', slug] as const,
  deleteShot: (slug: string, segmentId: string) => ['shots', slug, 'segment', segmentId, 'delete'] as const,
  deleteClip: (slug: string, segmentId: string) => ['clips', slug, segmentId, 'delete'] as const,
};
