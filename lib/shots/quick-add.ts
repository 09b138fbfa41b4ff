import { DEFAULT_CAMERA, DEFAULT_FRAMING, MAX_DESCRIPTION, type Camera, type Framing } from './catalog';

export type QuickShot = { framing: Framing; camera: Camera; description: string };
export type QuickAddResult = { shots: QuickShot[]; errors: { line: number; message: string }[] };

const normalise = (s: string) => s.toLowerCase().replace(/[\s_.-]+/g, ' ').trim();

// Film-set shorthand, from memory of common usage: WS/MS/CU/ECU/OH/POV.
const framingWords: [string, Framing][] = [
  ['extreme close up', 'extreme_close_up'],
  ['extreme closeup', 'extreme_close_up'],
  ['ecu', 'extreme_close_up'],
  ['xcu', 'extreme_close_up'],
  ['close up', 'close_up'],
  ['closeup', 'close_up'],
  ['cu', 'close_up'],
  ['wide', 'wide'],
  ['ws', 'wide'],
  ['medium', 'medium'],
  ['ms', 'medium'],
  ['overhead', 'overhead'],
  ['oh', 'overhead'],
  ['insert', 'insert'],
  ['ins', 'insert'],
  ['point of view', 'pov'],
  ['pov', 'pov'],
];
const cameraWords: [string, Camera][] = [
  ['a cam', 'a_cam'],
  ['acam', 'a_cam'],
  ['b cam', 'b_cam'],
  ['bcam', 'b_cam'],
  ['top cam', 'top_cam'],
  ['topcam', 'top_cam'],
  ['top', 'top_cam'],
  ['phone', 'phone'],
];
// Without a colon only the capitalised abbreviations count, so "Insert the dowel" stays a description.
const bareAbbreviations = new Map<string, Framing>([
  ['CU', 'close_up'],
  ['ECU', 'extreme_close_up'],
  ['XCU', 'extreme_close_up'],
  ['WS', 'wide'],
  ['MS', 'medium'],
  ['OH', 'overhead'],
  ['POV', 'pov'],
]);

/** Reads a head like "CU", "Overhead / Top cam" or "B cam, close-up"; null when any word is not a framing or camera. */
function readHead(head: string): { framing?: Framing; camera?: Camera } | null {
  const parts = head.split(/[/,+|]|\s+on\s+/i).map(normalise).filter(Boolean);
  if (parts.length === 0) return null;
  const out: { framing?: Framing; camera?: Camera } = {};
  for (const part of parts) {
    const framing = framingWords.find(([w]) => w === part || `${w} shot` === part)?.[1];
    const camera = cameraWords.find(([w]) => w === part)?.[1];
    if (framing && !out.framing) out.framing = framing;
    else if (camera && !out.camera) out.camera = camera;
    else return null;
  }
  return out;
}

function readLine(raw: string): QuickShot | string | null {
  const line = raw.replace(/^\s*(?:[-*•]+|\d+[.)])\s*/, '').trim();
  if (!line) return null;
  let framing: Framing = DEFAULT_FRAMING;
  let camera: Camera = DEFAULT_CAMERA;
  let description = line;
  const colon = line.indexOf(':');
  const head = colon > 0 && colon <= 40 ? readHead(line.slice(0, colon)) : null;
  if (head) {
    framing = head.framing ?? framing;
    camera = head.camera ?? camera;
    description = line.slice(colon + 1).trim();
  } else {
    const [first = '', ...rest] = line.split(/\s+/);
    const bare = bareAbbreviations.get(first);
    if (bare && rest.length > 0) {
      framing = bare;
      description = rest.join(' ');
    }
  }
  if (!description) return 'Write what the shot shows after the framing.';
  if (description.length > MAX_DESCRIPTION) return `Keep each shot under ${MAX_DESCRIPTION} characters.`;
  return { framing, camera, description };
}

/** One shot per non-empty line; bullets and numbers are dropped; line numbers in errors count from 1. */
export function parseShotLines(text: string): QuickAddResult {
  const shots: QuickShot[] = [];
  const errors: { line: number; message: string }[] = [];
  text.split(/\r?\n/).forEach((raw, i) => {
    const read = readLine(raw);
    if (read === null) return;
    if (typeof read === 'string') errors.push({ line: i + 1, message: read });
    else shots.push(read);
  });
  return { shots, errors };
}
