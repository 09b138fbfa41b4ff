'use client';

import { Button } from '@/components/ui/button';

export function PrintButton() {
  return (
    <Button onClick={() => window.print()} className="print:hidden">
      <svg aria-hidden="true" width="16" height="16" viewBox="0 0 16 16" fill="none" stroke="currentColor" strokeWidth="1.5">
        <path d="M4 6V1.75h8V6M4 12H2.25V6h11.5v6H12" strokeLinejoin="round" />
        <rect x="4" y="9.5" width="8" height="5" />
      </svg>
      Print
    </Button>
  );
}
