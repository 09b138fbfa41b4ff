import { can, type Role } from '@/lib/auth/policy';

/**
 * The one "delete own upload" rule, used by the clip route (a recorded clip) and the tus hooks (an
 * upload still in flight): a Host deletes any clip, a Shop hand only the ones they uploaded.
 */
export function mayDeleteClip(role: Role, uploaderId: string | null, userId: string): boolean {
  if (can(role, 'clips.delete')) return true;
  return uploaderId === userId && can(role, 'clips.deleteOwn');
}

export const DELETE_OWN_ONLY = 'A Shop hand deletes only the clips they uploaded.';

/**
 * Who may tie a clip to a shot or move it to another segment after the upload (issue 15): a Host any
 * clip, whoever uploaded it their own (while their role may still upload).
 */
export function mayFileClip(role: Role, uploaderId: string | null, userId: string): boolean {
  if (can(role, 'clips.delete')) return true;
  return uploaderId === userId && can(role, 'clips.upload');
}

export const FILE_OWN_ONLY = 'Only a Host or whoever uploaded this clip can tie it to a shot or move it.';
