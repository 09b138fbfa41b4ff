'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ApiError, apiFetch } from '@/lib/api/client';
import type { ApprovalDecision } from '@/lib/approvals/schemas';

export function ApprovalForm({ token, scriptVersion }: { token: string; scriptVersion: number }) {
  const router = useRouter();
  const [comment, setComment] = useState('');
  const [error, setError] = useState<string | null>(null);
  const decide = useMutation({
    mutationFn: (decision: ApprovalDecision) => apiFetch<{ decision: ApprovalDecision }>(`/api/approvals/${token}`, { method: 'POST', body: { decision, comment, scriptVersion } }),
    onSuccess: () => router.refresh(),
    onError: (err) => setError(err instanceof ApiError ? (err.fields.comment ?? err.message) : 'Could not send your answer.'),
  });
  return (
    <form onSubmit={(e) => e.preventDefault()} aria-label="Your answer" className="space-y-3">
      {error ? <Alert tone="attention">{error}</Alert> : null}
      <div>
        <label htmlFor="approval-comment" className="mb-1 block text-sm font-bold">
          Comment (needed when you request changes)
        </label>
        <textarea id="approval-comment" rows={4} value={comment} onChange={(e) => setComment(e.target.value)} maxLength={2000} className="block w-full rounded-md border border-ink/30 bg-white px-3 py-2 text-base" />
      </div>
      <div className="flex flex-wrap gap-2">
        <Button onClick={() => decide.mutate('approved')} disabled={decide.isPending}>
          Approve
        </Button>
        <Button variant="secondary" onClick={() => decide.mutate('changes_requested')} disabled={decide.isPending}>
          Request changes
        </Button>
      </div>
    </form>
  );
}
