'use client';

import { useId } from 'react';
import { Button } from '@/components/ui/button';
import { countOf } from '@/lib/text/count-of';
import { useShotMail } from './use-shop-board';

const emails = (n: number) => countOf(n, 'e-mail', 'e-mails');

function resultText({ sent, failed }: { sent: number; failed: number }): string {
  if (sent === 0 && failed === 0) return 'Nobody is waiting for an e-mail.';
  const parts = [sent > 0 ? `Sent ${emails(sent)}.` : '', failed > 0 ? `${emails(failed)} could not be sent; they go out with the next try.` : ''];
  return parts.filter(Boolean).join(' ');
}

const waitingText = (n: number) => (n === 0 ? 'Nobody waiting for an e-mail' : `${countOf(n, 'person', 'people')} waiting for an e-mail`);

/** Host only: assignment e-mails go now instead of a few minutes after the last change. */
export function SendToCrew({ slug, initialWaiting }: { slug: string; initialWaiting: number }) {
  const { waiting, send } = useShotMail(slug, initialWaiting);
  const noteId = useId();
  const n = waiting.data;
  const result = send.data;

  return (
    <div className="flex flex-wrap items-center gap-x-4 gap-y-2 rounded-card border border-paper-edge bg-white/60 px-3 py-2 text-sm">
      {/* aria-disabled rather than disabled: a disabled button drops the keyboard focus. */}
      <Button
        variant="secondary"
        onClick={() => {
          if (!send.isPending) send.mutate();
        }}
        aria-disabled={send.isPending}
        aria-describedby={noteId}
      >
        <MailIcon />
        Send to crew
      </Button>
      {/* One live region: the number waiting, replaced by what the last send did. */}
      <p role="status" className={`font-bold ${send.isError || (result && result.failed > 0) ? 'text-attention-ink' : result ? 'text-ok' : ''}`}>
        {send.isPending
          ? 'Sending…'
          : send.isError
            ? `Could not send: ${send.error.message}`
            : result
              ? `${resultText(result)}${n > 0 ? ` ${waitingText(n)} now.` : ''}`
              : waitingText(n)}
      </p>
      <p id={noteId} className="min-w-0 flex-1 basis-64 text-ink-soft">
        Otherwise assignment e-mails go out by themselves a few minutes after the last change.
      </p>
    </div>
  );
}

function MailIcon() {
  return (
    <svg aria-hidden="true" width="16" height="16" viewBox="0 0 16 16">
      <rect x="1.5" y="3.5" width="13" height="9" rx="1" fill="none" stroke="currentColor" strokeWidth="1.5" />
      <path d="M2 4.5l6 4.5 6-4.5" fill="none" stroke="currentColor" strokeWidth="1.5" />
    </svg>
  );
}
