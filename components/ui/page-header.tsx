import type { ReactNode } from 'react';

export function PageHeader({ title, children, actions }: { title: string; children?: ReactNode; actions?: ReactNode }) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-3 border-b border-paper-edge pb-4">
      <div>
        <h1 className="text-2xl font-bold tracking-tight">{title}</h1>
        {children ? <p className="mt-1 text-ink-soft">{children}</p> : null}
      </div>
      {actions ? <div className="flex gap-2">{actions}</div> : null}
    </header>
  );
}
