import { framesPerSecond } from '@/lib/timecode';
import type { Assembly } from './assembly';
import type { HandoffSnapshot } from './snapshot';

// OpenTimelineIO JSON. Source: OpenTimelineIO v0.18.1 schema reader, required fields as listed in
// STACK-NOTES.md (Timeline.1, Stack.1, Track.1, Clip.2, ExternalReference.1, Gap.1, Marker.2,
// TimeRange.1, RationalTime.1). Target URLs are relative to the clip package's root.

type RationalTime = { OTIO_SCHEMA: 'RationalTime.1'; rate: number; value: number };
type TimeRange = { OTIO_SCHEMA: 'TimeRange.1'; start_time: RationalTime; duration: RationalTime };

export function buildOtio(snapshot: HandoffSnapshot, assembly: Assembly): Record<string, unknown> {
  const rate = framesPerSecond(assembly.rate);
  const time = (value: number): RationalTime => ({ OTIO_SCHEMA: 'RationalTime.1', rate, value });
  const range = (start: number, duration: number): TimeRange => ({ OTIO_SCHEMA: 'TimeRange.1', start_time: time(start), duration: time(duration) });

  const children = assembly.items.map((item) =>
    item.kind === 'clip'
      ? {
          OTIO_SCHEMA: 'Clip.2',
          name: item.clip.name,
          source_range: range(0, item.frames),
          effects: [],
          markers: [],
          enabled: true,
          media_references: {
            DEFAULT_MEDIA: {
              OTIO_SCHEMA: 'ExternalReference.1',
              name: item.clip.name,
              target_url: encodeURI(item.path),
              available_range: range(0, item.frames),
              metadata: { kerfline: { clipId: item.clip.id, sha256: item.clip.sha256, sizeBytes: item.clip.sizeBytes } },
            },
          },
          active_media_reference_key: 'DEFAULT_MEDIA',
          metadata: { kerfline: { segment: item.segment.number, shot: item.shot?.number ?? null } },
        }
      : {
          OTIO_SCHEMA: 'Gap.1',
          name: item.shot ? `Shot ${item.shot.number} not captured: ${item.shot.description}` : `${item.segment.title}: nothing planned`,
          source_range: range(0, item.frames),
          effects: [],
          markers: [],
          enabled: true,
          metadata: {},
        },
  );

  const markers = snapshot.segments.map((segment) => ({
    OTIO_SCHEMA: 'Marker.2',
    name: `${segment.number}. ${segment.title}`,
    marked_range: range(assembly.segmentStarts.get(segment.id) ?? 0, 0),
    color: 'GREEN',
    comment: segment.title,
    metadata: {},
  }));

  return {
    OTIO_SCHEMA: 'Timeline.1',
    name: `${snapshot.episode.title} v${snapshot.version}`,
    global_start_time: null,
    metadata: { kerfline: { episodeId: snapshot.episode.id, version: snapshot.version, frameRate: snapshot.episode.frameRate } },
    tracks: {
      OTIO_SCHEMA: 'Stack.1',
      name: 'tracks',
      source_range: null,
      effects: [],
      markers: [],
      enabled: true,
      metadata: {},
      children: [
        { OTIO_SCHEMA: 'Track.1', name: 'V1', kind: 'Video', source_range: null, effects: [], markers, enabled: true, metadata: {}, children },
      ],
    },
  };
}

export const otioText = (snapshot: HandoffSnapshot, assembly: Assembly): string => `${JSON.stringify(buildOtio(snapshot, assembly), null, 2)}\n`;
