import { describe, expect, it } from 'vitest';
import { PROBE_CUT_OFF, PROBE_NOT_OPENED, PROBE_UNREADABLE, probeFailureNote } from './probe-note';

describe('probeFailureNote', () => {
  it('says in plain words what ffprobe meant, without its internals', () => {
    expect(probeFailureNote('[mov,mp4,m4a,3gp,3g2,mj2 @ 0x5581c2a4e2c0] moov atom not found\n/srv/up/ab12: Invalid data found when processing input')).toBe(
      PROBE_CUT_OFF,
    );
    expect(probeFailureNote('/srv/up/ab12: Invalid data found when processing input')).toBe(PROBE_UNREADABLE);
    expect(probeFailureNote('/srv/up/ab12: No such file or directory')).toBe(PROBE_NOT_OPENED);
    expect(probeFailureNote('')).toBe(PROBE_UNREADABLE);
  });

  it('never repeats tool output', () => {
    for (const out of ['[h264 @ 0x1] error while decoding MB 3 4', 'Unexpected end of JSON input', '/data/uploads/x: EOF']) {
      const note = probeFailureNote(out);
      expect(note).not.toMatch(/@ 0x|\[|\/data|ffprobe|JSON/);
    }
  });
});
