import type { ReactNode } from 'react';

type Tone = 'attention' | 'ok' | 'info';

const tones: Record<Tone, string> = {
  attention: 'border-attention bg-attention-soft text-attention-ink',
  ok: 'border-ok bg-ok-soft text-ok',
  info: 'border-blueprint-line bg-blueprint-soft text-blueprint',
};

export function Alert({ tone = 'info', children, title }: { tone?: Tone; children: ReactNode; title?: string }) {
  return (
    <div role={tone === 'attention' ? 'alert' : 'status'} className={`rounded-md border-l-4 px-4 py-3 text-sm ${tones[tone]}`}>
      {title ? <p className="font-bold">{title}</p> : null}
      <div>{children}</div>
    </div>
  );
}
