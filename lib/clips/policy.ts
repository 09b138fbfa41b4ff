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
