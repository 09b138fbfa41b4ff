/**
 * Names people read (channel, person, episode, segment, level, part, stock, shot, tool) must look
 * like what they are. Invisible format characters let one name pose as another ("Host" with a
 * zero-width space) and bidirectional overrides reorder what is shown ("gpj.exe" read backwards).
 * Source: Unicode Technical Standard #39 and Technical Report #36 (Unicode Security
 * Considerations), §2 "Visual Security Issues", on bidi controls and default-ignorable characters.
 */

// Bidi controls: ALM, LRM, RLM, LRE…RLO, LRI…PDI. Invisible: zero-width space, word joiner,
// invisible operators, zero-width no-break space (BOM), Mongolian vowel separator, soft hyphen.
// Control characters (C0, DEL, C1) never belong in a name either.
const REFUSED_CLASS = '[\u0000-\u001f\u007f-\u009f\u00ad\u061c\u180e\u200b\u200e\u200f\u202a-\u202e\u2060-\u2064\u2066-\u2069\ufeff]';
const ALWAYS_REFUSED = new RegExp(REFUSED_CLASS);

// Zero-width non-joiner and joiner are needed inside words in Persian, Hindi and other scripts and
// inside emoji sequences, so they are allowed only between two visible characters.
const STRAY_JOINER = /(?:^|[\s\u200c\u200d])[\u200c\u200d]|[\u200c\u200d](?:$|\s)/u;

export const INVISIBLE_CHARACTERS_MESSAGE =
  'Remove invisible or text-direction characters (such as zero-width spaces or right-to-left overrides); they can disguise a name.';

export function isVisibleName(value: string): boolean {
  return !ALWAYS_REFUSED.test(value) && !STRAY_JOINER.test(value);
}

/** For names that arrive with a file (clip uploads): the same characters are dropped, not refused. */
export function withoutInvisible(value: string): string {
  return value.replace(new RegExp(REFUSED_CLASS, 'g'), '').replace(/[\u200c\u200d]+(?=$|\s)|(?<=^|\s)[\u200c\u200d]+/gu, '');
}
