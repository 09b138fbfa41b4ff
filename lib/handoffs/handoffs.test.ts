import { describe, expect, it } from 'vitest';
import { diffHandoffs } from './diff';
import { buildHandoffMail } from './mail';
import { hashContent, parseSnapshot, serializeSnapshot } from './snapshot';
import { sampleInput, sampleSnapshot } from './test-snapshot';

describe('buildSnapshot', () => {
  const snap = sampleSnapshot();

  it('keeps running order with forecast starts, scripts as HTML and text, shots with their clips', () => {
    expect(snap.segments.map((s) => [s.number, s.title, s.startSeconds])).toEqual([
      [1, 'Cold open', 0],
      [2, 'Legs', 12],
      [3, 'Outro', 12 + 62],
    ]);
    expect(snap.segments[0]!.scriptHtml).toBe('<p>Today we build a stool</p>');
    expect(snap.segments[0]!.scriptText).toBe('Today we build a stool');
    expect(snap.segments[2]!.scriptHtml).toBe('');
    expect(snap.segments[1]!.shots.map((s) => [s.number, s.clips.map((c) => c.name)])).toEqual([
      [1, ['A001.mov']],
      [2, []],
    ]);
    expect(snap.segments[0]!.otherClips.map((c) => c.id)).toEqual(['c2']);
    expect(snap.segments[1]!.levelLabel).toBe('Starter');
    expect(snap.segments[1]!.safety[0]?.label).toBeTruthy();
    expect(snap.episode.totalSeconds).toBe(79);
  });

  it('serialises equal input to equal bytes and hashes them', () => {
    const a = serializeSnapshot(sampleSnapshot());
    expect(serializeSnapshot(sampleSnapshot())).toBe(a);
    expect(hashContent(a)).toMatch(/^[0-9a-f]{64}$/);
    expect(parseSnapshot(a)).toEqual(sampleSnapshot());
  });
});

describe('diffHandoffs', () => {
  it('finds nothing between equal versions', () => {
    expect(diffHandoffs(sampleSnapshot(), sampleSnapshot({ version: 2 })).unchanged).toBe(true);
  });

  it('reports added, removed and moved segments, word-level script changes, shot states and clips', () => {
    const base = sampleInput();
    const [s1, s2, s3] = base.segments as [typeof base.segments[0], typeof base.segments[0], typeof base.segments[0]];
    const next = sampleSnapshot({
      version: 2,
      segments: [
        { ...s2, script: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Cut both legs to length' }] }] } },
        s1,
        { ...s3, id: 's4', title: 'Bloopers' },
      ],
      shots: [{ ...base.shots[0]!, state: 'retake', retakeReason: 'Out of focus' }, { id: 'sh3', segmentId: 's2', description: 'Overhead', framing: 'overhead', camera: 'top_cam', state: 'planned', retakeReason: null }],
      clips: [base.clips[0]!, { ...base.clips[1]!, id: 'c3', name: 'intro-2.mp4' }],
    });
    const d = diffHandoffs(sampleSnapshot(), next);
    expect(d.unchanged).toBe(false);
    expect(d.segmentsAdded.map((s) => s.title)).toEqual(['Bloopers']);
    expect(d.segmentsRemoved.map((s) => s.title)).toEqual(['Outro']);
    expect(d.segmentsMoved).toHaveLength(1);
    expect(d.scripts).toHaveLength(1);
    const words = d.scripts[0]!.words;
    expect(words.filter((w) => w.change === 'removed').map((w) => w.text.trim())).toEqual(['the']);
    expect(words.filter((w) => w.change === 'added').map((w) => w.text.trim())).toEqual(['both']);
    expect(d.shotsAdded.map((s) => s.id)).toEqual(['sh3']);
    expect(d.shotsRemoved.map((s) => s.id)).toEqual(['sh2']);
    expect(d.shotsChanged).toEqual([{ segmentTitle: 'Legs', id: 'sh1', description: 'Wide of the saw', fromState: 'captured', toState: 'retake' }]);
    expect(d.clipsAdded.map((c) => c.name)).toEqual(['intro-2.mp4']);
    expect(d.clipsRemoved.map((c) => c.name)).toEqual(['intro.mp4']);
  });
});

describe('buildHandoffMail', () => {
  it('links the version and escapes the HTML', () => {
    const mail = buildHandoffMail({ to: 'e@x.test', channelName: 'Shop <b>', episodeTitle: 'Stool', version: 2, lockedBy: 'Rowan', note: 'Use take 2', url: 'http://h/x/2' });
    expect(mail.subject).toContain('v2');
    expect(mail.text).toContain('http://h/x/2');
    expect(mail.text).toContain('Use take 2');
    expect(mail.html).toContain('Shop &lt;b&gt;');
  });
});
