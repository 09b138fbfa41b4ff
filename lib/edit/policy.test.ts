import { describe, expect, it } from 'vitest';
import { mayReadClipNotes } from './policy';

describe('mayReadClipNotes', () => {
  it('lets Hosts and Editors read any clip’s notes, a Shop hand only their own uploads', () => {
    expect(mayReadClipNotes('host', 'u2', 'u1')).toBe(true);
    expect(mayReadClipNotes('editor', null, 'u1')).toBe(true);
    expect(mayReadClipNotes('shop_hand', 'u1', 'u1')).toBe(true);
    expect(mayReadClipNotes('shop_hand', 'u2', 'u1')).toBe(false);
    // A clip whose uploader left has no owner.
    expect(mayReadClipNotes('shop_hand', null, 'u1')).toBe(false);
  });
});
