import type { ReactNode } from 'react';

export function EmptyState({ title, children, action }: { title: string; children: ReactNode; action?: ReactNode }) {
  return (
    <section className="rounded-card border-2 border-dashed border-paper-edge bg-white/40 px-6 py-10 text-center">
      <h2 className="text-lg font-bold">{title}</h2>
      <div className="mx-auto mt-2 max-w-prose text-ink-soft">{children}</div>
      {action ? <div className="mt-5">{action}</div> : null}
    </section>
  );
}
