import { describe, expect, it } from 'vitest';
import { parseProbe, parseRate } from './probe';

// Source: the output of Debian's ffprobe 5.1 (`ffprobe -v error -print_format json -show_format -show_streams`)
// for a clip made with `ffmpeg -f lavfi -i testsrc=duration=3:size=320x240:rate=30 -f lavfi -i sine=... -c:v libx264 -c:a aac`,
// trimmed to the fields read here.
const testsrc = {
  streams: [
    { index: 0, codec_name: 'h264', codec_type: 'video', width: 320, height: 240, r_frame_rate: '30/1', avg_frame_rate: '30/1', duration: '3.000000' },
    { index: 1, codec_name: 'aac', codec_type: 'audio', r_frame_rate: '0/0', avg_frame_rate: '0/0', duration: '3.000000' },
  ],
  format: { format_name: 'mov,mp4,m4a,3gp,3g2,mj2', duration: '3.000000', size: '19327' },
};

describe('parseProbe', () => {
  it('reads duration, resolution, frame rate and codec of a video', () => {
    expect(parseProbe(testsrc)).toEqual({ durationSeconds: 3, width: 320, height: 240, frameRate: 30, codec: 'h264' });
  });

  it('reads an audio-only file without a picture', () => {
    expect(parseProbe({ streams: [testsrc.streams[1]], format: { duration: '12.5' } })).toEqual({ durationSeconds: 12.5, width: null, height: null, frameRate: null, codec: 'aac' });
  });

  it('says nothing rather than guessing for junk', () => {
    expect(parseProbe(null)).toEqual({ durationSeconds: null, width: null, height: null, frameRate: null, codec: null });
    expect(parseProbe({ streams: 'x', format: { duration: 'N/A' } }).durationSeconds).toBeNull();
  });

  // NTSC rates as rationals: 30000/1001 is the 29.97 of SMPTE ST 12-1.
  it('reads rational frame rates', () => {
    expect(parseRate('30000/1001')).toBeCloseTo(29.97, 2);
    expect(parseRate('24000/1001')).toBeCloseTo(23.976, 3);
    expect(parseRate('0/0')).toBeNull();
    expect(parseRate('25')).toBe(25);
  });
});
