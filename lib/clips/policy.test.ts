import { describe, expect, it } from 'vitest';
import { mayDeleteClip } from './policy';

describe('mayDeleteClip', () => {
  it('lets a Host delete anyone’s clip, and clips whose uploader left', () => {
    expect(mayDeleteClip('host', 'someone-else', 'me')).toBe(true);
    expect(mayDeleteClip('host', null, 'me')).toBe(true);
  });

  it('lets a Shop hand delete only their own uploads', () => {
    expect(mayDeleteClip('shop_hand', 'me', 'me')).toBe(true);
    expect(mayDeleteClip('shop_hand', 'someone-else', 'me')).toBe(false);
    expect(mayDeleteClip('shop_hand', null, 'me')).toBe(false);
  });

  it('never lets an Editor delete, not even a clip recorded under their id', () => {
    expect(mayDeleteClip('editor', 'me', 'me')).toBe(false);
  });
});
