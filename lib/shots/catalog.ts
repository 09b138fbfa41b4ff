// The shot vocabulary of GLOSSARY.md; stored keys are snake_case, labels are what the crew reads.
export const framings = ['wide', 'medium', 'close_up', 'extreme_close_up', 'overhead', 'insert', 'pov'] as const;
export type Framing = (typeof framings)[number];
export const framingLabels: Record<Framing, string> = {
  wide: 'Wide',
  medium: 'Medium',
  close_up: 'Close-up',
  extreme_close_up: 'Extreme close-up',
  overhead: 'Overhead',
  insert: 'Insert',
  pov: 'Point of view',
};

export const cameras = ['a_cam', 'b_cam', 'phone', 'top_cam'] as const;
export type Camera = (typeof cameras)[number];
export const cameraLabels: Record<Camera, string> = { a_cam: 'A cam', b_cam: 'B cam', phone: 'Phone', top_cam: 'Top cam' };

export const shotStates = ['planned', 'captured', 'retake'] as const;
export type ShotState = (typeof shotStates)[number];
export const shotStateLabels: Record<ShotState, string> = { planned: 'Planned', captured: 'Captured', retake: 'Retake' };

export const DEFAULT_FRAMING: Framing = 'medium';
export const DEFAULT_CAMERA: Camera = 'a_cam';
export const MAX_QUICK_ADD_LINES = 100;
export const MAX_DESCRIPTION = 300;
