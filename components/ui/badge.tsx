import type { ReactNode } from 'react';

// The small rounded labels on cards and rows (state, footage, due, safety). One look, a few tones;
// the accent colour only for what needs attention.
const tones = {
  /** Done or present: Captured, Has footage, Script. */
  ok: 'bg-ok-soft font-bold text-ok',
  okOutlined: 'border border-ok bg-ok-soft font-bold text-ok',
  /** Needs attention: Retake, Safety review pending. */
  attention: 'border border-attention bg-attention-soft font-bold text-attention-ink',
  attentionSoft: 'bg-attention-soft font-bold text-attention-ink',
  attentionSolid: 'bg-attention font-bold text-white',
  neutral: 'border border-ink/30 font-bold text-ink-soft',
  /** Something not there yet ("No script yet"). */
  missing: 'border border-dashed border-ink/30 text-ink-soft',
} as const;

export type BadgeTone = keyof typeof tones;

export function Badge({ tone, icon, className = '', children }: { tone: BadgeTone; icon?: ReactNode; className?: string; children: ReactNode }) {
  return (
    <span className={`inline-flex items-center gap-1 rounded-full px-2 py-0.5 text-xs ${tones[tone]} ${className}`}>
      {icon}
      {children}
    </span>
  );
}
