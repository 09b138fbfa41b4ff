import { can, type Role } from '@/lib/auth/policy';

/**
 * Who reads the edit notes on a clip (issue 14: "Host and Editor write; Shop hand reads notes on clips
 * they uploaded"). Used by the clip-notes route and, to decide whether to offer them, by the clip card.
 */
export function mayReadClipNotes(role: Role, uploaderId: string | null, userId: string): boolean {
  if (can(role, 'editNotes.edit')) return true;
  return uploaderId !== null && uploaderId === userId && can(role, 'clips.upload');
}

export const CLIP_NOTES_OWN_ONLY = 'A Shop hand reads the notes on clips they uploaded.';
