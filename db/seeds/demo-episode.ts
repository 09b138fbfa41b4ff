import type { Knex } from 'knex';
import { generateNKeysBetween } from 'fractional-indexing';
import { scriptStats } from '../../lib/scripts/plain-text';
import type { ScriptDoc } from '../../lib/scripts/schemas';

// Invented demo content: an original project, an invented sponsor. Not a real person, brand or video.
type DemoSegment = { kind: string; level: number | null; title: string; actionSeconds: number; script: string[] };

const segments: DemoSegment[] = [
  {
    kind: 'cold_open',
    level: null,
    title: 'Cold open: three stools on the bench',
    actionSeconds: 12,
    script: [
      'Three shop stools. Same height, same footprint, same job: something to sit on while you sharpen, and something to stand on when the top shelf is just out of reach.',
      "The one on the left went together in an afternoon with a drill and a box of screws. The middle one is doweled, no metal anywhere. And the one on the right has wedged through-tenons that will outlast me. Today we build all three, and you pick the one that fits your shop and your tools.",
    ],
  },
  {
    kind: 'build',
    level: 1,
    title: 'Starter: pocket-screwed pine stool',
    actionSeconds: 150,
    script: [
      "Let's start with the version anyone can build this weekend. All you need is a circular saw or a handsaw, a drill, a pocket-hole jig and construction-grade two by fours.",
      "Pick your boards at the yard like you mean it: sight down each one, skip the twisted ones, and look for tight growth rings near the edges. Knots in the middle of a leg are fine; a knot right where a screw goes is not.",
      "Cut the four legs to length first, then the aprons. Clamp the legs together and mark them all at once so they match. If you're using a circular saw, clamp a straightedge as a guide, keep both hands on the saw and let the blade stop before you lift it. Your saw's manual has the details for your model; read it.",
      "Drill two pocket holes at each end of every apron, on the inside face. Glue the joint, clamp it flat to the bench, and drive the screws. Glue plus screws is stronger than either one alone, and it means the stool won't wobble loose next winter.",
      "Build two leg frames, then join them with the remaining aprons. Check the diagonals: if they match, it's square. The seat is two boards edge-glued and screwed up from underneath through the aprons, with slightly oversized holes so the wood can move with the seasons.",
      "Break every edge with sandpaper, give it a coat of oil, and you're done. That's a stool you can stand on tomorrow.",
    ],
  },
  {
    kind: 'build',
    level: 2,
    title: 'Intermediate: doweled ash stool',
    actionSeconds: 210,
    script: [
      'Level two trades the screws for dowels. Same design, but now the joints are all wood, and the stool is made from ash, which is tough, springy and cheap in most places.',
      "The secret to dowels is registration. A doweling jig clamps to the work and guides the drill bit dead square, so the holes in the leg and the holes in the apron line up. Mark a reference face on every part and always put the jig against that face. Do that and everything lines up. Skip it and nothing does.",
      "Two three-eighths dowels per joint, drilled a little deeper than half the dowel length on each side, so glue has somewhere to go. Fluted dowels let the air and the extra glue escape; smooth ones can split a leg when you drive them home.",
      "Dry-fit everything first. Every time. If it doesn't go together dry, it definitely won't go together with glue starting to grab. Then glue up the leg frames, check for square, and let them cure before joining the two frames.",
      "For the seat, I'm gluing up three narrower boards with the growth rings alternating. It stays flatter that way. Attach it with figure-eight fasteners so it can expand and shrink across the grain without cracking.",
      "Ash takes finish beautifully. Two coats of oil-based wipe-on finish, with a light sanding in between. Rags soaked with oil finish can heat up and catch fire as they dry, so lay them flat outside or put them in a sealed metal can with water. The finish maker's label tells you how for that product.",
    ],
  },
  {
    kind: 'sponsor_read',
    level: null,
    title: 'Sponsor read: Brightgrain Abrasives',
    actionSeconds: 8,
    script: [
      'This video is sponsored by Brightgrain Abrasives, who make the hook-and-loop sanding discs I used on all three stools today.',
      "What I like about their mesh discs is that dust goes straight through them into the extractor, so they don't clog and they last. There's a link in the description for a starter pack with every grit from eighty to three twenty.",
    ],
  },
  {
    kind: 'build',
    level: 3,
    title: 'Advanced: wedged through-tenon oak stool',
    actionSeconds: 300,
    script: [
      'Level three is the heirloom. White oak, through-tenons at every joint, and wedges driven into saw kerfs so the tenons flare inside the mortise and can never pull out.',
      'Lay out the mortises from the reference faces with a marking gauge, on both sides of the leg. Chop halfway from each side and meet in the middle; that way neither face gets blown out when the chisel breaks through.',
      "Cut the tenons a hair long. Saw the cheeks on the waste side of the line, then pare to a snug fit with a sharp chisel. You want to push it home with hand pressure, maybe a tap from a mallet. If you need to beat on it, it's too tight and you'll split the leg.",
      "Before glue-up, saw two kerfs in each tenon, square to the grain of the leg so the wedges spread the tenon along the length of the mortise and don't split the leg. Flare the ends of the mortise very slightly on the outside face. That's where the wedge pushes the tenon into a dovetail shape.",
      "Rive the wedges from straight-grained offcuts of oak. Glue up, drive the wedges in pairs so they go in evenly, and listen: the note rises as they tighten. Stop when it sings. Saw them flush once the glue is cured.",
      "The seat gets a slight dish carved with a travisher, and the whole stool gets the same oil as level two. It's slower, it's harder, and it is the most satisfying thing I've built all year.",
    ],
  },
  {
    kind: 'outro',
    level: null,
    title: 'Outro: which stool should you build?',
    actionSeconds: 10,
    script: [
      "So which one should you build? If you've never made furniture, build the pine one this weekend and use it. If you've got a few projects behind you, the doweled ash stool will teach you about accuracy. And if you want a challenge, the oak stool is waiting.",
      'Plans for all three, with a cut list for each level, are linked below. Tell me in the comments which one you are building, and I will see you next time.',
    ],
  },
];

const toDoc = (paragraphs: string[]): ScriptDoc => ({
  type: 'doc',
  content: paragraphs.map((text) => ({ type: 'paragraph', content: [{ type: 'text', text }] })),
});

export async function seedDemoEpisode(trx: Knex.Transaction, channelId: string): Promise<void> {
  const [episode] = await trx('episodes')
    .insert({
      channel_id: channelId,
      title: 'One Stool, Three Ways',
      premise: 'The same shop stool built with pocket screws, then dowels, then wedged through-tenons.',
      stage: 'outline',
      target_seconds: 15 * 60,
      shoot_date: '2027-01-16',
      publish_date: '2027-02-04',
    })
    .returning<{ id: string }[]>('id');
  if (!episode) throw new Error('demo episode insert returned no row');
  const keys = generateNKeysBetween(null, null, segments.length);
  await trx('segments').insert(
    segments.map((s, i) => {
      const doc = toDoc(s.script);
      const { text, wordCount } = scriptStats(doc);
      return {
        episode_id: episode.id,
        position: keys[i],
        kind: s.kind,
        level: s.level,
        title: s.title,
        action_seconds: s.actionSeconds,
        script: JSON.stringify(doc),
        script_text: text,
        word_count: wordCount,
        script_version: 1,
      };
    }),
  );
  await trx('episodes').insert({ channel_id: channelId, title: 'Bench hook and shooting board', premise: 'Two jigs every hand-tool shop needs.', stage: 'idea' });
}
