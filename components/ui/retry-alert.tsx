import type { ReactNode } from 'react';
import { Alert } from './alert';
import { Button } from './button';

/** A failed load or refresh, with the server's message and a way to ask again. */
export function RetryAlert({ title, children, onRetry }: { title?: string; children: ReactNode; onRetry: () => void }) {
  return (
    <Alert tone="attention" title={title}>
      <span className="flex flex-wrap items-center justify-between gap-2">
        <span>{children}</span>
        <Button variant="secondary" className="-my-1" onClick={onRetry}>
          Try again
        </Button>
      </span>
    </Alert>
  );
}
