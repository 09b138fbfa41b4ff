import { cameras, type Camera } from '@/lib/shots/catalog';
import { channelPage } from '@/lib/api/paths';

// Shared by the server page and the client board, so both read the same filters from one URL.

export type BoardFilters = {
  episodeId?: string;
  segmentId?: string;
  assigneeId?: string;
  camera?: Camera;
};

export type ShotsView = 'board' | 'mine';

type Params = Record<string, string | string[] | undefined>;

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const first = (v: string | string[] | undefined): string | undefined => (Array.isArray(v) ? v[0] : v);
const isCamera = (v: string | undefined): v is Camera => v !== undefined && (cameras as readonly string[]).includes(v);

export const viewOf = (params: Params): ShotsView => (first(params.view) === 'mine' ? 'mine' : 'board');

/** A hand-edited URL with a bad value shows the unfiltered board for that filter rather than an error page. */
export function parseBoardFilters(params: Params): BoardFilters {
  const episodeId = first(params.episodeId);
  const segmentId = first(params.segmentId);
  const assigneeId = first(params.assigneeId);
  const camera = first(params.camera);
  const out: BoardFilters = {};
  if (episodeId && UUID.test(episodeId)) out.episodeId = episodeId;
  // A segment only narrows a chosen episode.
  if (out.episodeId && segmentId && UUID.test(segmentId)) out.segmentId = segmentId;
  if (assigneeId && (assigneeId === 'none' || UUID.test(assigneeId))) out.assigneeId = assigneeId;
  if (isCamera(camera)) out.camera = camera;
  return out;
}

/** The query string for both the page URL and GET /shots, in a fixed order so equal filters give equal strings. */
export function filtersToSearch(filters: BoardFilters): string {
  const q = new URLSearchParams();
  if (filters.episodeId) q.set('episodeId', filters.episodeId);
  if (filters.segmentId) q.set('segmentId', filters.segmentId);
  if (filters.assigneeId) q.set('assigneeId', filters.assigneeId);
  if (filters.camera) q.set('camera', filters.camera);
  return q.toString();
}

export const sameFilters = (a: BoardFilters, b: BoardFilters): boolean => filtersToSearch(a) === filtersToSearch(b);

export const segmentHref = (slug: string, episodeId: string, segmentId: string) => channelPage(slug, 'episodes', episodeId, 'segments', segmentId);
export const shotHref = (slug: string, shot: { episodeId: string; segmentId: string; id: string }) =>
  `${segmentHref(slug, shot.episodeId, shot.segmentId)}#shot-${shot.id}`;
