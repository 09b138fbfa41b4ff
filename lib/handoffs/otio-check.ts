// A checker of the OpenTimelineIO required-field rules, for tests (no OTIO reader runs on Node).
// Source: OpenTimelineIO v0.18.1 schema reader, as summarised in STACK-NOTES.md.

type Json = Record<string, unknown>;
const isObj = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);

const required: Record<string, string[]> = {
  'RationalTime.1': ['rate', 'value'],
  'TimeRange.1': ['start_time', 'duration'],
  'Timeline.1': ['tracks'],
  'Stack.1': ['children'],
  'Track.1': ['children', 'kind'],
  'Clip.2': ['media_references', 'active_media_reference_key'],
  'ExternalReference.1': ['target_url'],
  'Marker.2': ['marked_range'],
  'Gap.1': [],
};

/** Every problem found, as "path: message"; [] when the document follows the rules. */
export function checkOtio(doc: unknown, path = '$'): string[] {
  if (Array.isArray(doc)) return doc.flatMap((d, i) => checkOtio(d, `${path}[${i}]`));
  if (!isObj(doc)) return [];
  const errors: string[] = [];
  const schema = doc.OTIO_SCHEMA;
  if (typeof schema === 'string') {
    const fields = required[schema];
    if (!fields) errors.push(`${path}: unknown schema ${schema}`);
    else for (const f of fields) if (!(f in doc)) errors.push(`${path}: ${schema} lacks ${f}`);
    if (schema === 'RationalTime.1' && (typeof doc.rate !== 'number' || typeof doc.value !== 'number' || !(doc.rate > 0))) errors.push(`${path}: rate and value are numbers`);
    if (schema === 'Track.1' && doc.kind !== 'Video' && doc.kind !== 'Audio') errors.push(`${path}: kind is Video or Audio`);
    if (schema === 'Clip.2') {
      const refs = doc.media_references;
      const key = doc.active_media_reference_key;
      if (!isObj(refs) || typeof key !== 'string' || !isObj(refs[key])) errors.push(`${path}: the active media reference exists`);
    }
    if (schema === 'Timeline.1' && (!isObj(doc.tracks) || doc.tracks.OTIO_SCHEMA !== 'Stack.1')) errors.push(`${path}: tracks is a Stack.1`);
    if (schema === 'ExternalReference.1' && typeof doc.target_url !== 'string') errors.push(`${path}: target_url is a string`);
  }
  for (const [k, v] of Object.entries(doc)) errors.push(...checkOtio(v, `${path}.${k}`));
  return errors;
}
