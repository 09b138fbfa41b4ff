import { describe, expect, it } from 'vitest';
import { displayName, formatBytes } from './names';
import { isAcceptedType } from './schemas';

describe('clip names and types', () => {
  it('keeps only the last part of a path-like name and drops control characters', () => {
    expect(displayName('../../x')).toBe('x');
    expect(displayName('C:\\clips\\A001_C002.mov')).toBe('A001_C002.mov');
    expect(displayName('bad\u0007name.mp4')).toBe('badname.mp4');
    expect(displayName('../..')).toBe('clip');
    expect(displayName('take\u202E4pm.exe')).toBe('take4pm.exe');
    expect(displayName('\u200Bglue-up.mov')).toBe('glue-up.mov');
  });

  it('accepts video, audio and still images, not SVG or documents', () => {
    for (const t of ['video/mp4', 'video/quicktime', 'audio/wav', 'image/jpeg', 'image/heic']) expect(isAcceptedType(t)).toBe(true);
    for (const t of ['image/svg+xml', 'text/html', 'application/pdf', 'video/', 'video/mp4; rm -rf']) expect(isAcceptedType(t)).toBe(false);
    // Any +xml subtype is a document, whatever tree it claims (issue 12 item 13).
    for (const t of ['image/x-foo+xml', 'video/vnd.evil+xml', 'audio/anything+xml', 'image/svg', 'image/x-icon+xml', 'video/mp4+xml']) {
      expect(isAcceptedType(t), t).toBe(false);
    }
    for (const t of ['VIDEO/MP4', 'video/x-matroska', 'image/x-adobe-dng', 'audio/x-m4a']) expect(isAcceptedType(t), t).toBe(true);
  });

  it('prints sizes in binary units', () => {
    expect(formatBytes(512)).toBe('512 B');
    expect(formatBytes(1536)).toBe('1.5 KiB');
    expect(formatBytes(50 * 1024 ** 3)).toBe('50 GiB');
  });
});
