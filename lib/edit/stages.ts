// Edit stages, in the order an edit moves through them (editing terms, GLOSSARY.md).
export const editStages = ['assembly', 'rough_cut', 'fine_cut', 'picture_lock'] as const;
export type EditStage = (typeof editStages)[number];

export const editStageLabels: Record<EditStage, string> = {
  assembly: 'Assembly',
  rough_cut: 'Rough cut',
  fine_cut: 'Fine cut',
  picture_lock: 'Picture lock',
};
