import { can } from '@/lib/auth/policy';
import type { Membership } from '@/lib/channels/queries';
import { forbidden } from '@/lib/errors';
import type { UpdateShotInput } from './schemas';

/** A Host edits any shot; a Shop hand edits the shots assigned to them and may not hand them on. */
export function assertMayEditShot(member: Membership, shot: { assigneeId: string | null }, input: UpdateShotInput): void {
  if (can(member.role, 'shots.edit')) return;
  if (!can(member.role, 'shots.editAssigned') || shot.assigneeId !== member.userId) {
    throw forbidden('A Shop hand edits only the shots assigned to them.');
  }
  if (input.assigneeId !== undefined && input.assigneeId !== member.userId) throw forbidden('Only a Host assigns shots.');
}

export const mayEditShot = (member: Pick<Membership, 'role' | 'userId'>, shot: { assigneeId: string | null }): boolean =>
  can(member.role, 'shots.edit') || (can(member.role, 'shots.editAssigned') && shot.assigneeId === member.userId);
